package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.slopewatch.probability.ProbitFitException.Reason;

/**
 * The iterations on their own, bypassing the fitter's exact separation check: the second line
 * of defence must still name separation, and a regular fit must end where the score vanishes
 * (the first-order condition of a maximum).
 */
class FisherScoringTest {

    private static final int N = 40;

    @Test
    void separatedDataEndInASeparationErrorNotALoop() {
        double[] s = new double[N];
        boolean[] y = new boolean[N];
        for (int i = 0; i < N; i++) {
            y[i] = i < 10;
            s[i] = y[i] ? -1.0 - 0.01 * i : 0.5 + 0.01 * i;
        }
        ProbitFitException e = catchThrowableOfType(ProbitFitException.class,
                () -> FisherScoring.maximize(new ProbitLikelihood(s, y), Gaussian.inverseCdf(0.25), 100, 1e-10));
        assertThat(e.reason()).isEqualTo(Reason.SEPARATION);
        assertThat(e.getMessage()).contains("numerically 0 or 1");
    }

    @Test
    void aRegularFitStopsWhereTheScoreVanishes() {
        double[] s = new double[N];
        boolean[] y = new boolean[N];
        for (int i = 0; i < N; i++) {
            s[i] = Math.sin(i) + 0.02 * i;          // spreads that overlap between the classes
            y[i] = i % 3 == 0 ? s[i] < 0.5 : s[i] < -0.3;
        }
        FisherScoring.Result r = FisherScoring.maximize(new ProbitLikelihood(s, y), 0.0, 100, 1e-10);
        assertThat(r.evaluation.gradAlpha).as("d logL / d alpha at the estimate").isCloseTo(0.0, within(1e-8));
        assertThat(r.evaluation.gradBeta).as("d logL / d beta at the estimate").isCloseTo(0.0, within(1e-8));
        assertThat(r.beta).isNegative();
    }
}
