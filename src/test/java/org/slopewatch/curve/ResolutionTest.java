package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.Gen;
import org.slopewatch.testsupport.PropertyCheck;

/**
 * The resolution rule against decimal arithmetic: {@link BigDecimal} on the decimal strings a feed
 * sends (the reference), 2,000 random samples per property ({@link PropertyCheck} prints the seed of a
 * failing one). Six decimals, half to even, as {@link RoundingMode#HALF_EVEN} defines it.
 */
class ResolutionTest {

    private static final Resolution BP = Resolution.BASIS_POINTS;

    /** A quote in percent with 0 to 6 decimals, between −5 % and 30 %, as its decimal string. */
    private static final Gen<BigDecimal> QUOTES = r -> {
        int scale = r.nextInt(7);
        long bound = 30 * (long) Math.pow(10, scale);
        return BigDecimal.valueOf(r.nextLong(-bound / 6, bound + 1), scale);
    };

    /** A value in bp with 0 to 6 decimals, within ±3,000 bp. */
    private static final Gen<BigDecimal> BP_VALUES = r -> {
        int scale = r.nextInt(7);
        long bound = 3_000 * (long) Math.pow(10, scale);
        return BigDecimal.valueOf(r.nextLong(-bound, bound + 1), scale);
    };

    record Legs(BigDecimal longLeg, BigDecimal shortLeg, int thresholdPick) {
        BigDecimal spreadBp() {
            return longLeg.subtract(shortLeg).movePointRight(2);
        }
    }

    @Test
    void aSpreadOfDecimalQuotesIsTheirExactDifferenceAndComparesAsItDoes() {
        Gen<Legs> legs = r -> new Legs(QUOTES.next(r), QUOTES.next(r), r.nextInt(4));
        PropertyCheck.forAll(2_000, legs, l -> {
            // the feed's path: the JSON number's double, to bp, then the difference
            double longBp = YieldUnit.PERCENT.toBasisPoints(Double.parseDouble(l.longLeg().toPlainString()));
            double shortBp = YieldUnit.PERCENT.toBasisPoints(Double.parseDouble(l.shortLeg().toPlainString()));
            double spread = BP.round(BP.round(longBp) - BP.round(shortBp));
            BigDecimal exact = l.spreadBp();
            assertThat(spread).as("%s − %s", l.longLeg(), l.shortLeg()).isEqualTo(exact.doubleValue());
            // thresholds on the value, a step either side, and a whole number near it
            BigDecimal step = BigDecimal.ONE.movePointLeft(6);
            BigDecimal threshold = switch (l.thresholdPick()) {
                case 0 -> exact;
                case 1 -> exact.add(step);
                case 2 -> exact.subtract(step);
                default -> exact.setScale(0, RoundingMode.FLOOR);
            };
            double t = threshold.doubleValue();
            assertThat(BP.below(spread, t)).as("%s < %s", exact, threshold).isEqualTo(exact.compareTo(threshold) < 0);
            assertThat(BP.above(spread, t)).as("%s > %s", exact, threshold).isEqualTo(exact.compareTo(threshold) > 0);
        });
    }

    @Test
    void anAverageIsTheExactAverageToSixDecimalsAndComparesAsItDoes() {
        Gen<List<BigDecimal>> lists = BP_VALUES.list(1, 120);
        PropertyCheck.forAll(2_000, lists, values -> {
            long sum = 0;
            BigDecimal exactSum = BigDecimal.ZERO;
            for (BigDecimal v : values) {
                sum += BP.units(v.doubleValue());
                exactSum = exactSum.add(v);
            }
            BigDecimal n = BigDecimal.valueOf(values.size());
            BigDecimal average = exactSum.divide(n, 6, RoundingMode.HALF_EVEN);
            assertThat(BP.average(sum, values.size())).isEqualTo(average.doubleValue());
            // a bound exactly on the average, and a step either side of it
            for (BigDecimal bound : List.of(average, average.add(BigDecimal.ONE.movePointLeft(6)), average.subtract(BigDecimal.ONE.movePointLeft(6)))) {
                assertThat(BP.averageBelow(sum, values.size(), bound.doubleValue())).as("average %s < %s", average, bound)
                        .isEqualTo(average.compareTo(bound) < 0);
            }
        });
    }

    @Test
    void anAverageHalfwayBetweenTwoStepsGoesToTheEvenOne() {
        // 1 and 2 steps average 1.5 → 2; 2 and 3 average 2.5 → 2; −1 and −2 average −1.5 → −2 (HALF_EVEN)
        assertThat(BP.average(3, 2)).isEqualTo(new BigDecimal("0.0000015").setScale(6, RoundingMode.HALF_EVEN).doubleValue())
                .isEqualTo(0.000002);
        assertThat(BP.average(5, 2)).isEqualTo(new BigDecimal("0.0000025").setScale(6, RoundingMode.HALF_EVEN).doubleValue())
                .isEqualTo(0.000002);
        assertThat(BP.average(-3, 2)).isEqualTo(new BigDecimal("-0.0000015").setScale(6, RoundingMode.HALF_EVEN).doubleValue())
                .isEqualTo(-0.000002);
        assertThat(BP.average(0, 0)).isNaN();
    }

    record Share(int count, int of, BigDecimal share) {
    }

    @Test
    void aShareIsComparedExactly() {
        Gen<Share> shares = r -> {
            int of = 1 + r.nextInt(400);
            int count = r.nextInt(of + 1);
            // the share exactly on count/of when that is a decimal of six places, else a random one
            BigDecimal exact = BigDecimal.valueOf(count).divide(BigDecimal.valueOf(of), MathContext.DECIMAL128);
            BigDecimal share = r.nextBoolean() && exact.stripTrailingZeros().scale() <= 6 && count > 0 ? exact
                    : BigDecimal.valueOf(1 + r.nextInt(1_000_000), 6);
            return new Share(count, of, share);
        };
        PropertyCheck.forAll(2_000, shares, s -> {
            boolean exact = BigDecimal.valueOf(s.count()).compareTo(s.share().multiply(BigDecimal.valueOf(s.of()))) >= 0;
            assertThat(Resolution.PROBABILITY.shareAtLeast(s.count(), s.of(), s.share().doubleValue()))
                    .as("%d of %d at least %s", s.count(), s.of(), s.share()).isEqualTo(exact);
        });
        assertThat(Resolution.PROBABILITY.shareAtLeast(7, 10, 0.7)).isTrue();
        assertThat(Resolution.PROBABILITY.shareAtLeast(6, 10, 0.7)).isFalse();
    }

    @Test
    void whatIsNotANumberOrBeyondTheRangeIsLeftAsItIs() {
        assertThat(BP.round(Double.NaN)).isNaN();
        assertThat(BP.round(Double.NEGATIVE_INFINITY)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(BP.round(1e300)).isEqualTo(1e300);
        assertThat(BP.round(4.999999999999886)).isEqualTo(5.0);
        assertThat(BP.round(-39.99999999999994)).isEqualTo(-40.0);
    }
}
