package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * Sources: synthetic curves generated with the published Nelson–Siegel (1987) and Svensson (1994)
 * formulas ({@link SvenssonFormula}, from memory), written independently of the code under test;
 * the least-squares property that the optimum fits at least as well as any other parameter set.
 */
class NssFitterTest {

    private static final LocalDate DATE = LocalDate.of(2024, 5, 31);
    private static final String[] ELEVEN = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};
    // parameters from exact points: a snapshot takes each yield to 1e-6 bp (curve.Resolution), so
    // the points are exact only to half of that, and the search stops once the RMSE is below 1e-6 bp;
    // on the first set below that left the betas within 1.1e-5 bp and the taus within 3e-7 years of the truth
    private static final double PARAMETER_TOLERANCE = 1e-4;
    private static final SvenssonFormula TRUTH = new SvenssonFormula(450, -150, 200, -100, 1.5, 8);

    @Test
    void recoversSvenssonCurveFromNoiseFreePoints() {
        NssFit fit = NssFitter.fitDetailed(sample(TRUTH, ELEVEN)).orElseThrow();

        assertThat(fit.svensson()).as("11 points: six-parameter form").isTrue();
        assertThat(fit.points()).isEqualTo(11);
        assertThat(fit.rmseBp()).as("noise-free points are fitted exactly").isLessThan(1e-6);
        for (String tenor : ELEVEN) {
            double t = Tenor.parse(tenor).years();
            assertThat(fit.curve().zeroRate(t)).as("zero rate at %s", tenor).isCloseTo(TRUTH.zero(t), within(1e-3));
        }
        // between and around the quoted points, including the forward the spread reads
        for (double t = 0.05; t <= 30.0; t += 0.05) {
            assertThat(fit.curve().zeroRate(t)).as("zero rate at %.2fy", t).isCloseTo(TRUTH.zero(t), within(1e-3));
        }
        assertThat(fit.curve().forwardRate(1.5, 1.75)).as("3M forward 18M ahead")
                .isCloseTo(TRUTH.forward(1.5, 1.75), within(1e-3));
    }

    /*
     * Source: Gürkaynak, R. S., Sack, B. and Wright, J. H. (2007), "The U.S. Treasury Yield Curve:
     * 1961 to the Present", Journal of Monetary Economics 54(8), which fits the same Svensson form
     * to continuously compounded zero yields and publishes the six parameters daily (from memory).
     * The sets below, in percent and years, are of the magnitudes that published series shows
     * (β0 a few percent, β1 negative, τ1 near one to two years, τ2 near ten; from memory), not any
     * one date's row: a steep curve, an inverted one with a hump, and one with a dip at the short end.
     * Curves generated exactly from them are recovered: the parameters, and the forward the spread reads.
     */
    @Test
    void recoversPublishedFormParametersFromExactPoints() {
        double[][] percentAndYears = {
            {5.0, -3.0, -2.0, 3.0, 1.5, 10.0},
            {4.2, 1.1, -2.5, 1.5, 1.2, 8.0},
            {6.0, -1.5, 3.0, -2.0, 2.0, 12.0},
        };
        for (double[] p : percentAndYears) {
            SvenssonFormula truth = new SvenssonFormula(100 * p[0], 100 * p[1], 100 * p[2], 100 * p[3], p[4], p[5]);
            NssFit fit = NssFitter.fitDetailed(sample(truth, ELEVEN)).orElseThrow();
            NelsonSiegelSvensson c = fit.curve();
            assertThat(fit.rmseBp()).as("exact points fitted exactly: %s", truth).isLessThan(1e-6);
            assertThat(new double[] {c.beta0(), c.beta1(), c.beta2(), c.beta3(), c.tau1(), c.tau2()})
                    .as("parameters recovered (bp, years): %s", truth)
                    .containsExactly(new double[] {truth.b0(), truth.b1(), truth.b2(), truth.b3(), truth.tau1(), truth.tau2()},
                            within(PARAMETER_TOLERANCE));
            assertThat(c.forwardRate(1.5, 1.75)).as("3M forward 18M ahead: %s", truth)
                    .isCloseTo(truth.forward(1.5, 1.75), within(1e-6));
        }
    }

    @Test
    void recoversNelsonSiegelCurveFromFivePoints() {
        // an inverted curve with a dip, as before a recession
        SvenssonFormula truth = SvenssonFormula.nelsonSiegel(420, 110, -60, 2.5);
        String[] five = {"3M", "1Y", "2Y", "5Y", "10Y"};
        NssFit fit = NssFitter.fitDetailed(sample(truth, five)).orElseThrow();

        assertThat(fit.svensson()).as("5 points: plain Nelson–Siegel").isFalse();
        assertThat(fit.curve().beta3()).isZero();
        assertThat(fit.curve().tau2()).isEqualTo(fit.curve().tau1());
        for (double t = 0.25; t <= 10.0; t += 0.05) {
            assertThat(fit.curve().zeroRate(t)).as("zero rate at %.2fy", t).isCloseTo(truth.zero(t), within(1e-3));
        }
    }

    @Test
    void fourPointsAreFittedWithNelsonSiegel() {
        SvenssonFormula truth = SvenssonFormula.nelsonSiegel(500, -200, 150, 1.8);
        String[] four = {"3M", "2Y", "5Y", "10Y"};
        NssFit fit = NssFitter.fitDetailed(sample(truth, four)).orElseThrow();

        assertThat(fit.svensson()).isFalse();
        for (String tenor : four) {
            double t = Tenor.parse(tenor).years();
            assertThat(fit.curve().zeroRate(t)).as("passes through %s", tenor).isCloseTo(truth.zero(t), within(1e-3));
        }
    }

    /*
     * With ±2 bp added alternately to the 11 points, the true parameters leave an RMSE of exactly
     * 2 bp; a least-squares optimum can only do better, so a larger RMSE means a start got stuck.
     */
    @Test
    void noisyPointsFitAtLeastAsWellAsTheTrueCurve() {
        Map<Tenor, Double> yields = new LinkedHashMap<>();
        for (int i = 0; i < ELEVEN.length; i++) {
            Tenor tenor = Tenor.parse(ELEVEN[i]);
            yields.put(tenor, TRUTH.zero(tenor.years()) + (i % 2 == 0 ? 2.0 : -2.0));
        }
        NssFit fit = NssFitter.fitDetailed(CurveSnapshot.of("SYN", DATE, yields)).orElseThrow();

        assertThat(fit.rmseBp()).as("least-squares optimum no worse than the truth").isLessThanOrEqualTo(2.0 + 1e-9);
        assertThat(fit.rmseBp()).as("cannot fit the noise away with 6 parameters and 11 points").isGreaterThan(0.1);
    }

    @Test
    void flatCurveGivesFlatForwards() {
        for (String[] tenors : new String[][] {ELEVEN, {"3M", "1Y", "2Y", "5Y", "10Y"}}) {
            Map<Tenor, Double> yields = new LinkedHashMap<>();
            for (String tenor : tenors) {
                yields.put(Tenor.parse(tenor), 425.0);
            }
            NelsonSiegelSvensson curve = NssFitter.fit(CurveSnapshot.of("FLAT", DATE, yields)).orElseThrow();
            assertThat(curve.forwardRate(1.5, 1.75)).as("forward on a flat curve, %d points", tenors.length)
                    .isCloseTo(425.0, within(1e-6));
            assertThat(curve.instantaneousForward(7.0)).isCloseTo(425.0, within(1e-6));
        }
    }

    @Test
    void fewerThanFourPointsGiveNoFit() {
        assertThat(NssFitter.fit(sample(TRUTH, "3M", "2Y", "10Y"))).isEmpty();
        assertThat(NssFitter.fit(CurveSnapshot.empty("NONE", DATE))).isEmpty();
        assertThat(NssFitter.MIN_POINTS).isEqualTo(4);
    }

    @Test
    void nonConvergenceGivesEmptyInsteadOfThrowing() {
        // one evaluation is never enough to converge from any start on a curved set of points
        Optional<NssFit> fit = NssFitter.fitDetailed(sample(TRUTH, ELEVEN), 1);
        assertThat(fit).isEmpty();
    }

    @Test
    void infiniteYieldGivesEmpty() {
        CurveSnapshot snapshot = sample(TRUTH, ELEVEN).with(Tenor.years(5), Double.POSITIVE_INFINITY);
        assertThat(NssFitter.fit(snapshot)).isEmpty();
    }

    static CurveSnapshot sample(SvenssonFormula truth, String... tenors) {
        Map<Tenor, Double> yields = new LinkedHashMap<>();
        for (String text : tenors) {
            Tenor tenor = Tenor.parse(text);
            yields.put(tenor, truth.zero(tenor.years()));
        }
        return CurveSnapshot.of("SYN", DATE, yields);
    }
}
