package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.YearMonth;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The fit on the Treasury 10Y−1Y monthly averages 1953-04..1999-09 with the NBER dates, horizon
 * 12 months, against R's {@code glm(family = binomial(link = "probit"))} and
 * {@code sandwich::NeweyWest(lag = 12, prewhite = FALSE, adjust = FALSE)}.
 *
 * <p>Source of every expected value: src/test/resources/reference/probit-10y1y-h12.csv, written
 * by src/test/reference/probit/probit_reference.R (R 4.2.2, sandwich 3.0.2; exact command in the
 * file's header). The script builds the sample the same way as {@link ProbitSample#build}:
 * recession = months after a peak through its trough, inclusive; months m with m + 12 after
 * 1999-09 dropped.
 */
class ProbitFitterReferenceTest {

    private static Map<String, Double> r;
    private static ProbitFit fit;

    @BeforeAll
    static void fitOnce() {
        r = ReferenceFiles.probitReference();
        List<MonthlyAverage> months = MonthlyAverager.average(ReferenceFiles.tenYearMinusOneYear());
        fit = new ProbitFitter(FitOptions.horizon(12)).fit(months, ReferenceFiles.nberCalendar());
    }

    /** Agreement to {@code digits} significant digits: |actual − expected| ≤ ½·10^(1−digits)·|expected|. */
    private static void assertSignificant(double actual, String quantity, int digits) {
        double expected = r.get(quantity);
        double tolerance = 0.5 * Math.pow(10, 1 - digits) * Math.abs(expected);
        assertThat(Math.abs(actual - expected))
                .as("%s: ours %s vs R %s (%d significant digits)", quantity, actual, expected, digits)
                .isLessThanOrEqualTo(tolerance);
    }

    @Test
    void dataFileMatchesItsPublishedFacts() {
        // Shared data README: "the 10Y-1Y spread is negative in 113 of the 558 months".
        assertThat(ReferenceFiles.tenYearMinusOneYear()).filteredOn(o -> o.spreadPct() < 0).hasSize(113);
    }

    @Test
    void sampleIsTheOneRFitted() {
        assertThat(fit.months()).as("n").isEqualTo(r.get("n").intValue());
        assertThat(fit.recessionAheadMonths()).as("months with a recession 12 months ahead")
                .isEqualTo(r.get("recession_ahead_months").intValue());
        // R script header: sample 1953-04 to 1998-09
        assertThat(fit.firstMonth()).isEqualTo(YearMonth.of(1953, 4));
        assertThat(fit.lastMonth()).isEqualTo(YearMonth.of(1998, 9));
    }

    @Test
    void coefficientsMatchGlm() {
        assertSignificant(fit.alpha(), "alpha", 4);
        assertSignificant(fit.beta(), "beta", 4);
    }

    @Test
    void modelBasedStandardErrorsMatchVcovOfGlm() {
        assertSignificant(fit.seAlpha(CovarianceKind.MODEL_BASED), "se_alpha_model", 4);
        assertSignificant(fit.seBeta(CovarianceKind.MODEL_BASED), "se_beta_model", 4);
    }

    @Test
    void neweyWestStandardErrorsMatchSandwich() {
        assertThat(fit.hacLag()).as("default lag = horizon").isEqualTo(12);
        assertSignificant(fit.seAlpha(CovarianceKind.NEWEY_WEST), "se_alpha_newey_west", 4);
        assertSignificant(fit.seBeta(CovarianceKind.NEWEY_WEST), "se_beta_newey_west", 4);
    }

    @Test
    void likelihoodsAndPseudoR2MatchLogLik() {
        assertSignificant(fit.logLikelihood(), "log_likelihood", 4);
        assertSignificant(fit.nullLogLikelihood(), "null_log_likelihood", 4);
        double ll = r.get("log_likelihood");
        double ll0 = r.get("null_log_likelihood");
        int n = r.get("n").intValue();
        // McFadden (1974) and Estrella (1998) definitions applied to R's log-likelihoods
        assertThat(fit.mcFaddenR2()).isCloseTo(1 - ll / ll0, within(1e-6));
        assertThat(fit.estrellaR2()).isCloseTo(1 - Math.pow(ll / ll0, -(2.0 / n) * ll0),
                within(1e-6));
        assertThat(fit.spreadAtEvenOdds()).isCloseTo(-r.get("alpha") / r.get("beta"),
                within(1e-5));
    }

    @Test
    void ninetyPercentBandsMatchPredictAndTheNeweyWestLinkVariance() {
        for (double s : new double[] {-1.0, 0.0, 1.0}) {
            String tag = s < 0 ? "m1" : s == 0 ? "0" : "1";
            ProbabilityBand model = fit.band(s, 0.90, CovarianceKind.MODEL_BASED);
            ProbabilityBand hac = fit.band(s, 0.90, CovarianceKind.NEWEY_WEST);
            assertSignificant(model.probability(), "p_at_" + tag, 4);
            assertSignificant(model.lower(), "band90_model_lower_at_" + tag, 4);
            assertSignificant(model.upper(), "band90_model_upper_at_" + tag, 4);
            assertSignificant(hac.lower(), "band90_newey_west_lower_at_" + tag, 4);
            assertSignificant(hac.upper(), "band90_newey_west_upper_at_" + tag, 4);
            assertThat(hac.covariance()).isEqualTo(CovarianceKind.NEWEY_WEST);
        }
    }
}
