package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class ProbitModelTest {

    /**
     * α = −0.662, β = −0.811: the probit curve implied by Estrella and Mishkin (1996), Table 1
     * (from memory; see src/test/resources/reference and the shared data README).
     */
    private static final ProbitModel ESTRELLA_MISHKIN = new ProbitModel(-0.662, -0.811,
            "implied by Estrella and Mishkin (1996), Table 1, 10Y-3M, four quarters ahead (from memory)");

    /**
     * Estrella, A. and Mishkin, F. S. (1996), "The Yield Curve as a Predictor of U.S. Recessions",
     * Current Issues in Economics and Finance 2(7), FRBNY, Table 1 (from memory):
     * probability of recession four quarters ahead against the 10Y−3M spread.
     */
    @ParameterizedTest(name = "P = {0} at spread {1} pp")
    @CsvSource({
            "0.05, 1.21", "0.10, 0.76", "0.15, 0.46", "0.20, 0.22", "0.25, 0.02", "0.30, -0.17",
            "0.40, -0.50", "0.50, -0.82", "0.60, -1.13", "0.70, -1.46", "0.80, -1.85", "0.90, -2.40"})
    void reproducesTheEstrellaMishkinTable(double published, double spreadPct) {
        assertThat(ESTRELLA_MISHKIN.probability(spreadPct))
                .as("Estrella-Mishkin (1996) Table 1 within half a percentage point at %s pp", spreadPct)
                .isCloseTo(published, within(0.005));
        // The inverse: the table's least-squares probit leaves at most 0.004 in Φ⁻¹ units, i.e.
        // 0.004/0.811 ≈ 0.005 pp of spread, so 0.01 pp is a safe bound that would catch a sign slip.
        assertThat(ESTRELLA_MISHKIN.spreadAtProbability(published))
                .as("spread at which the curve gives the table's probability")
                .isCloseTo(spreadPct, within(0.01));
    }

    @Test
    void evenOddsIsMinusAlphaOverBeta() {
        // Estrella-Mishkin (1996) Table 1 (from memory): 50 % at -0.82 pp.
        assertThat(ESTRELLA_MISHKIN.spreadAtEvenOdds()).isCloseTo(-0.82, within(0.01));
    }

    @Test
    void rejectsWhatCannotBeAProbabilityModel() {
        assertThatThrownBy(() -> new ProbitModel(Double.NaN, -0.8))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("finite");
        assertThatThrownBy(() -> ESTRELLA_MISHKIN.probability(Double.NaN))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("spread");
        assertThatThrownBy(() -> ESTRELLA_MISHKIN.spreadAtProbability(1.0))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("strictly between 0 and 1");
        assertThatThrownBy(() -> new ProbitModel(-0.5, 0.0).spreadAtProbability(0.3))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("beta is 0");
    }

    @Test
    void provenanceIsKeptAndNeverNull() {
        assertThat(ESTRELLA_MISHKIN.provenance()).contains("Estrella and Mishkin");
        assertThat(new ProbitModel(-0.5, -0.6, null).provenance()).isEmpty();
    }
}
