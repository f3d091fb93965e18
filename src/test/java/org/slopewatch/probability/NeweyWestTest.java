package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.YearMonth;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The Bartlett weighting and the gap rule of {@link NeweyWest}, on three months worked by hand.
 * With every spread 1 and A⁻¹ the identity, each entry of V equals the scalar
 * S = Σ u_i² + 2 Σ_l (1 − l/(L+1)) Σ u_i u_{i+l}; scores u = (1, −1, 2).
 */
class NeweyWestTest {

    private static final double[] SPREAD = {1.0, 1.0, 1.0};
    private static final double[] SCORE = {1.0, -1.0, 2.0};
    private static final Covariance IDENTITY = new Covariance(1.0, 0.0, 1.0);

    private static List<YearMonth> months(int... offsets) {
        YearMonth start = YearMonth.of(2000, 11); // across a year end on purpose
        return Arrays.stream(offsets).mapToObj(start::plusMonths).toList();
    }

    @Test
    void lagOneWeighsNeighboursByOneHalf() {
        // S = (1 + 1 + 4) + 2·(1/2)·(1·(−1) + (−1)·2) = 6 − 3 = 3
        Covariance v = NeweyWest.covariance(months(0, 1, 2), SPREAD, SCORE, IDENTITY, 1);
        assertThat(v.varAlpha()).isCloseTo(3.0, within(1e-12));
        assertThat(v.covAlphaBeta()).isCloseTo(3.0, within(1e-12));
        assertThat(v.varBeta()).isCloseTo(3.0, within(1e-12));
    }

    @Test
    void theLastLagStillCountsWithWeightOneOverLPlusOne() {
        // sandwich::NeweyWest weights 1 - l/(L+1): L = 2 gives 2/3 at lag 1 and 1/3 at lag 2.
        // S = 6 + 2·(2/3)·(−3) + 2·(1/3)·(1·2) = 6 − 4 + 4/3 = 10/3
        Covariance v = NeweyWest.covariance(months(0, 1, 2), SPREAD, SCORE, IDENTITY, 2);
        assertThat(v.varAlpha()).isCloseTo(10.0 / 3.0, within(1e-12));
    }

    @Test
    void aMissingMonthBreaksTheLagChain() {
        // Months 0, 1, 3: only the first two are one month apart, the last pair is two apart.
        // L = 1: S = 6 + 2·(1/2)·(1·(−1)) = 5
        Covariance v = NeweyWest.covariance(months(0, 1, 3), SPREAD, SCORE, IDENTITY, 1);
        assertThat(v.varAlpha()).isCloseTo(5.0, within(1e-12));
    }

    @Test
    void lagZeroIsWhitesEstimator() {
        // S = Σ u_i² = 6
        Covariance v = NeweyWest.covariance(months(0, 1, 2), SPREAD, SCORE, IDENTITY, 0);
        assertThat(v.varAlpha()).isCloseTo(6.0, within(1e-12));
    }
}
