package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.YearMonth;
import java.util.Locale;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

/**
 * A live probability in words. Sources: the Estrella and Trubin (2006) coefficients for 10Y-3M,
 * alpha = -0.5333, beta = -0.6330, twelve months ahead (from memory); the band's construction
 * (delta method on the index alpha + beta*s, mapped through Phi, see ProbabilityBand) recomputed
 * here with Commons Math's NormalDistribution, independently of the code under test.
 */
class ProbabilityTextTest {

    private static final NormalDistribution PHI = new NormalDistribution();
    private static final ProbitModel MODEL = new ProbitModel(-0.5333, -0.6330, "Estrella and Trubin (2006) (from memory)");

    @Test
    void aCompleteMonthWithABandSaysHorizonSpreadMonthBandAndModel() {
        // October 2026 averaged -25 bp over 21 days; covariance var(a) 0.01, cov -0.004, var(b) 0.02 (invented)
        Covariance cov = new Covariance(0.01, -0.004, 0.02);
        LiveProbability p = LiveProbability.of(MODEL, cov, 12, YearMonth.of(2026, 10), -25.0, 21, false);
        double s = -0.25;
        double eta = -0.5333 - 0.6330 * s;
        double se = Math.sqrt(0.01 + 2 * s * -0.004 + s * s * 0.02);
        double z = PHI.inverseCumulativeProbability(0.95);
        String expected = String.format(Locale.ROOT, "12-month-ahead recession probability %.0f %% (90 %% band %.0f\u2013%.0f %%): "
                + "P(recession in 2027-10), from the 10Y-3M average of 2026-10 (complete month, 21 observations); "
                + "model: Estrella and Trubin (2006) (from memory)", 100 * PHI.cumulativeProbability(eta),
                100 * PHI.cumulativeProbability(eta - z * se), 100 * PHI.cumulativeProbability(eta + z * se));
        assertThat(ProbabilityText.sentence("10Y-3M", p)).isEqualTo(expected);
    }

    @Test
    void theMonthSoFarIsMarkedProvisionalAndNoBandIsSaidOutright() {
        LiveProbability p = LiveProbability.of(MODEL, null, 12, YearMonth.of(2026, 11), 10.0, 1, true);
        assertThat(ProbabilityText.sentence("10Y-3M", p)).isEqualTo(String.format(Locale.ROOT,
                "12-month-ahead recession probability %.0f %% (no band: the model has no covariance): P(recession in 2027-11), "
                        + "from the 10Y-3M average of 2026-11 so far (provisional: month to date, 1 observation); "
                        + "model: Estrella and Trubin (2006) (from memory)", 100 * PHI.cumulativeProbability(-0.5333 - 0.6330 * 0.10)));
    }

    @Test
    void aProbabilityNearZeroOrOneKeepsADecimalRatherThanReading0Or100() {
        // Phi(-3) = 0.00135 and Phi(3) = 0.99865 (standard normal table)
        assertThat(ProbabilityText.percent(PHI.cumulativeProbability(-3))).isEqualTo("0.1 %");
        assertThat(ProbabilityText.percent(PHI.cumulativeProbability(3))).isEqualTo("99.9 %");
        assertThat(ProbabilityText.percent(0.234)).isEqualTo("23 %");
    }
}
