package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.InversionMonitor;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.Observation;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.SpreadTrack;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.probability.ProbitModel;
import org.slopewatch.spread.SpreadKey;

/**
 * The live probability the daemon shows: the policy's probit on the calendar-month average.
 * Sources: the probit formula P = Φ(α + β·s) with Φ from Commons Math's {@code NormalDistribution}
 * (a reference implementation, independent of the code under test); coefficients of
 * Estrella–Trubin (2006) for 10Y−3M, α = −0.5333, β = −0.6330 (from memory); the monthly averages
 * recomputed by hand from the values fed in. Probabilities are given to six decimals
 * ({@code Resolution.PROBABILITY}), so each is within half a step, 5·10⁻⁷, of Commons Math's value.
 */
class LiveProbabilityTest {

    private static final SpreadKey KEY = new SpreadKey("GOVT-A", "10Y-3M");
    private static final ProbabilityModels MODELS = new ProbabilityModels(Map.of("10Y-3M", new SpreadProbabilityModel("10Y-3M",
            new ProbitModel(-0.5333, -0.6330, "Estrella and Trubin (2006), from memory"), 12, SpreadProbabilityModel.Averaging.MONTHLY)));
    private static final NormalDistribution PHI = new NormalDistribution();
    /** Half a step of six decimals, and a hair for the binary value of the step itself. */
    private static final org.assertj.core.data.Offset<Double> SIX_DECIMALS = within(5e-7 + 1e-15);

    @Test
    void currentMonthIsProvisionalAndTheMonthBeforeFinal() {
        SpreadTrack track = new SpreadTrack(new InversionMonitor(new MonitorDefinition(0, 5, 5, 365, List.of(new DaysInverted(90)))), KEY);
        // June: -10, -30 (average -20 bp); July so far: -50, -70, -90 (average -70 bp)
        double[] june = {-10, -30};
        double[] july = {-50, -70, -90};
        long seq = 0;
        for (int i = 0; i < june.length; i++) {
            track.record(new Observation(LocalDate.of(2026, 6, 29 + i), june[i], ++seq));
        }
        for (int i = 0; i < july.length; i++) {
            track.record(new Observation(LocalDate.of(2026, 7, 1 + i), july[i], ++seq));
        }
        SpreadStatus status = SpreadStatus.of(track);

        LiveProbability now = MODELS.current(status).orElseThrow();
        assertThat(now.month()).isEqualTo(YearMonth.of(2026, 7));
        assertThat(now.provisional()).isTrue();
        assertThat(now.averageBp()).isCloseTo(-70.0, within(1e-12));
        assertThat(now.observations()).isEqualTo(3);
        assertThat(now.targetMonth()).isEqualTo(YearMonth.of(2027, 7));
        assertThat(now.probability()).isCloseTo(PHI.cumulativeProbability(-0.5333 - 0.6330 * -0.70), SIX_DECIMALS);

        LiveProbability june2026 = MODELS.lastMonth(status).orElseThrow();
        assertThat(june2026.provisional()).isFalse();
        assertThat(june2026.month()).isEqualTo(YearMonth.of(2026, 6));
        assertThat(june2026.averageBp()).isCloseTo(-20.0, within(1e-12));
        assertThat(june2026.probability()).isCloseTo(PHI.cumulativeProbability(-0.5333 - 0.6330 * -0.20), SIX_DECIMALS);
    }

    /*
     * The band: delta method on the index η = α + β·s with var(η) = var α + 2s·cov + s²·var β, mapped
     * through Φ (the construction documented in ProbabilityBand), recomputed here with Commons Math.
     */
    @Test
    void aModelWithACovarianceShowsTheNinetyPercentBand() {
        ProbabilityModels withCovariance = new ProbabilityModels(Map.of("10Y-3M", new SpreadProbabilityModel("10Y-3M",
                new ProbitModel(-0.5333, -0.6330, "test"), 12, SpreadProbabilityModel.Averaging.MONTHLY,
                new org.slopewatch.probability.Covariance(0.01, -0.004, 0.02))));
        SpreadTrack track = new SpreadTrack(new InversionMonitor(new MonitorDefinition(0, 5, 5, 365, List.of(new DaysInverted(90)))), KEY);
        track.record(new Observation(LocalDate.of(2026, 7, 1), -50, 1));
        LiveProbability p = withCovariance.current(SpreadStatus.of(track)).orElseThrow();
        double s = -0.5;
        double eta = -0.5333 - 0.6330 * s;
        double se = Math.sqrt(0.01 + 2 * s * -0.004 + s * s * 0.02);
        double z = PHI.inverseCumulativeProbability(0.95);
        assertThat(p.band().lower()).isCloseTo(PHI.cumulativeProbability(eta - z * se), SIX_DECIMALS);
        assertThat(p.band().upper()).isCloseTo(PHI.cumulativeProbability(eta + z * se), SIX_DECIMALS);
        assertThat(p.band().level()).isEqualTo(0.90);
        assertThat(MODELS.current(SpreadStatus.of(track)).orElseThrow().band()).as("no covariance, no band").isNull();
    }

    @Test
    void aSpreadWithoutAModelHasNoProbability() {
        SpreadTrack track = new SpreadTrack(new InversionMonitor(new MonitorDefinition(0, 5, 5, 365, List.of(new DaysInverted(90)))),
                new SpreadKey("GOVT-A", "10Y-2Y"));
        track.record(new Observation(LocalDate.of(2026, 7, 1), -10, 1));
        assertThat(MODELS.current(SpreadStatus.of(track))).isEmpty();
        assertThat(MODELS.lastMonth(SpreadStatus.of(track))).isEmpty();
    }
}
