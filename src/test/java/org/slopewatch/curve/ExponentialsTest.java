package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The exponentials the fit takes as products against {@link Math#exp} itself (the JDK's, accurate
 * to one unit in the last place by its specification): e^(−(a+b)/τ) = e^(−a/τ)·e^(−b/τ).
 */
class ExponentialsTest {

    // the Treasury's par-curve tenors, 1M to 30Y, in years
    private static final double[] TREASURY = {1.0 / 12, 2.0 / 12, 3.0 / 12, 4.0 / 12, 6.0 / 12, 1, 2, 3, 5, 7, 10, 20, 30};

    @Test
    void productsAgreeWithTheExponentialWithinTheirChainsRounding() {
        Exponentials plan = Exponentials.of(TREASURY);
        assertThat(plan.calls()).as("exponentials computed, the rest products").isLessThan(TREASURY.length / 2);
        double[] out = new double[TREASURY.length];
        Random random = new Random(11L);
        for (int k = 0; k < 10_000; k++) {
            double tau = Math.exp(Math.log(0.05) + (Math.log(50) - Math.log(0.05)) * random.nextDouble());
            plan.fill(1.0 / tau, out);
            for (int i = 0; i < TREASURY.length; i++) {
                double x = TREASURY[i] / tau;
                double exact = Math.exp(-x);
                // Rounding x = t/τ moves either form by x·2⁻⁵³ relative. A product carries its factors'
                // errors, so a maturity built from m times the shortest (30Y from 1M: m = 360) carries
                // up to m times its error: relative m·2⁻⁵² in all, 8e-14 at 30Y, an absolute error below
                // 1e-13 in a loading, the precision the loading's own formula is allowed.
                double m = TREASURY[i] / TREASURY[0];
                assertThat(Math.abs(out[i] - exact)).as("t=%s τ=%s", TREASURY[i], tau)
                        .isLessThanOrEqualTo((m + x) * 0x1p-52 * exact + Double.MIN_NORMAL);
            }
        }
    }

    @Test
    void maturitiesWithNoExactSumTakeTheExponential() {
        double[] years = {0.3, 0.7, 1.1};
        Exponentials plan = Exponentials.of(years);
        assertThat(plan.calls()).isEqualTo(3);
        double[] out = new double[3];
        plan.fill(1 / 2.5, out);
        for (int i = 0; i < 3; i++) {
            assertThat(out[i]).isEqualTo(Math.exp(-years[i] * (1 / 2.5)));
        }
    }
}
