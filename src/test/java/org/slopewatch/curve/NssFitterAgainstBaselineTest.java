package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * The fit with its grid kept per set of maturities ({@link DecayGrids}) against the fit that
 * rebuilt the grid for every snapshot ({@link BaselineNssFitter}, a copy of it kept in test code).
 * The kept grid does the same arithmetic, so the two must agree to the last bit: same betas, same
 * taus, same RMSE, hence the same sum of squares and the same near-term forward. Any stale or
 * mismatched grid (a grid of other maturities, or of other bounds) shows as a difference.
 *
 * <p>Sources: curves generated with the Svensson (1994) form ({@link SvenssonFormula}, from memory)
 * from a seeded random parameter set over ranges of the size U.S. curves have shown, plus noise;
 * and the Federal Reserve's H.15 constant-maturity yields, 1953–1999
 * (src/test/resources/reference/README.md for provenance).
 */
class NssFitterAgainstBaselineTest {

    private static final LocalDate DATE = LocalDate.of(2024, 5, 31);
    private static final String[] ELEVEN = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};
    private static final Tenor[] CMT = {Tenor.years(1), Tenor.years(3), Tenor.years(5), Tenor.years(10)};
    // the near-term forward spread's forward: 18 to 21 months ahead
    private static final double FORWARD_FROM = 1.5;
    private static final double FORWARD_TO = 1.75;

    @Test
    void randomCurvesOnElevenTenorsFitExactlyAsBefore() {
        Random random = new Random(20_240_531L);
        for (int k = 0; k < 3_000; k++) {
            SvenssonFormula truth = randomCurve(random);
            assertSameFit(noisySample(truth, ELEVEN, random), "11 tenors, curve " + k + " " + truth);
        }
    }

    /*
     * Snapshots with random subsets of the tenors (at least four), interleaved, so that the kept
     * grids are looked up for many different maturities in turn, more than the cache holds
     * (2^11 subsets): a grid served for the wrong maturities would fit differently.
     */
    @Test
    void randomTenorSubsetsInterleavedFitExactlyAsBefore() {
        Random random = new Random(7L);
        Set<String> tenorSets = new HashSet<>();
        for (int k = 0; k < 3_000; k++) {
            List<String> tenors = new ArrayList<>();
            for (String tenor : ELEVEN) {
                if (random.nextDouble() < 0.6) {
                    tenors.add(tenor);
                }
            }
            if (tenors.size() < NssFitter.MIN_POINTS) {
                continue;
            }
            tenorSets.add(String.join(",", tenors));
            SvenssonFormula truth = randomCurve(random);
            assertSameFit(noisySample(truth, tenors.toArray(String[]::new), random), tenors + " curve " + k + " " + truth);
        }
        assertThat(tenorSets.size()).as("distinct tenor sets seen").isGreaterThan(DecayGrids.MAX_GRIDS);
        assertThat(DecayGrids.size()).as("grids kept").isLessThanOrEqualTo(DecayGrids.MAX_GRIDS);
    }

    @Test
    void realTreasuryMonthsFitExactlyAsBefore() throws IOException {
        List<CurveSnapshot> months = cmtMonths();
        assertThat(months).as("months in the reference file").hasSize(558);
        for (CurveSnapshot month : months) {
            assertSameFit(month, "H.15 " + month.date());
        }
    }

    private static void assertSameFit(CurveSnapshot snapshot, String what) {
        Optional<NssFit> now = NssFitter.fitDetailed(snapshot);
        Optional<NssFit> before = BaselineNssFitter.fitDetailed(snapshot);
        assertThat(now.isPresent()).as("fitted now as before: %s", what).isEqualTo(before.isPresent());
        if (now.isEmpty()) {
            return;
        }
        NssFit a = now.get();
        NssFit b = before.get();
        // what the near-term forward spread reads, and the least-squares objective
        assertThat(a.curve().forwardRate(FORWARD_FROM, FORWARD_TO)).as("forward 18–21 months: %s", what)
                .isEqualTo(b.curve().forwardRate(FORWARD_FROM, FORWARD_TO));
        assertThat(a.rmseBp()).as("RMSE: %s", what).isEqualTo(b.rmseBp());
        assertThat(a).as("whole fit: %s", what).isEqualTo(b);
    }

    /*
     * Ranges in bp and years wide enough for every U.S. curve since the 1950s: levels 1 % to 9 %,
     * slopes of either sign up to 4 %, humps either way, first decay 0.2 to 5 years, second 2 to 25.
     */
    private static SvenssonFormula randomCurve(Random random) {
        return new SvenssonFormula(100 + 800 * random.nextDouble(), -400 + 700 * random.nextDouble(),
                -500 + 1000 * random.nextDouble(), -500 + 1000 * random.nextDouble(),
                0.2 + 4.8 * random.nextDouble(), 2 + 23 * random.nextDouble());
    }

    /** Points of the curve plus noise of 0, 0.5, 2 or 5 bp standard deviation. */
    private static CurveSnapshot noisySample(SvenssonFormula truth, String[] tenors, Random random) {
        double[] sigma = {0.0, 0.5, 2.0, 5.0};
        double noise = sigma[random.nextInt(sigma.length)];
        Map<Tenor, Double> yields = new LinkedHashMap<>();
        for (String text : tenors) {
            Tenor tenor = Tenor.parse(text);
            yields.put(tenor, truth.zero(tenor.years()) + noise * random.nextGaussian());
        }
        return CurveSnapshot.of("SYN", DATE, yields);
    }

    private static List<CurveSnapshot> cmtMonths() throws IOException {
        List<CurveSnapshot> months = new ArrayList<>();
        try (BufferedReader in = new BufferedReader(new InputStreamReader(Objects.requireNonNull(
                NssFitterAgainstBaselineTest.class.getResourceAsStream("/reference/us-cmt-monthly-1953-1999.csv")),
                StandardCharsets.UTF_8))) {
            assertThat(in.readLine()).isEqualTo("date,1Y,3Y,5Y,10Y");
            for (String line = in.readLine(); line != null; line = in.readLine()) {
                String[] f = line.split(",");
                double[] bp = new double[CMT.length];
                for (int i = 0; i < bp.length; i++) {
                    bp[i] = YieldBounds.DEFAULT.toBasisPoints(Double.parseDouble(f[i + 1]), YieldUnit.PERCENT);
                }
                months.add(CurveSnapshot.ofSorted("H15", LocalDate.parse(f[0]), CMT, bp));
            }
        }
        return months;
    }
}
