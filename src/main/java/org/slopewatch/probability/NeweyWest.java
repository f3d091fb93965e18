package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.List;

/**
 * Newey–West covariance of the probit coefficients.
 *
 * <p>Convention, matched to R's sandwich package (3.0.2) called as
 * {@code sandwich::NeweyWest(glm(y ~ s, family = binomial(link = "probit")), lag = L,
 * prewhite = FALSE, adjust = FALSE)}:
 * <pre>
 *   V = A⁻¹ S A⁻¹,   A = X'WX  (expected information, the inverse of vcov(glm)),
 *   S = Σ_i u_i u_i' + Σ_{l=1..L} (1 − l/(L+1)) Σ_i (u_i u_{i+l}' + u_{i+l} u_i'),
 * </pre>
 * u_i the score of month i. Bartlett weights 1 − l/(L+1) for l = 0..L (so lag L itself still
 * gets weight 1/(L+1)), no n/(n−k) small-sample factor ({@code adjust = FALSE}), no VAR
 * prewhitening ({@code prewhite = FALSE}; sandwich's default is TRUE). sandwich's scaling
 * (bread = n·A⁻¹, meat = S/n, result divided by n) cancels to the formula above.
 *
 * <p>Lags count calendar months, not rows: a gap in the monthly series acts as a month with a
 * zero score, which keeps S positive semi-definite. Without gaps this is exactly sandwich's
 * row-order sum.
 */
final class NeweyWest {

    private NeweyWest() {
    }

    /**
     * @param months        sample months in increasing order
     * @param spread        s_i per month
     * @param scoreFactor   u_i per month: the score of month i is u_i·(1, s_i)
     * @param inverseInfo   A⁻¹, the model-based covariance
     * @param lag           L ≥ 0 (L = 0 gives White's heteroskedasticity-consistent covariance)
     */
    static Covariance covariance(List<YearMonth> months, double[] spread, double[] scoreFactor,
                                 Covariance inverseInfo, int lag) {
        int n = spread.length;
        long[] index = new long[n];
        for (int i = 0; i < n; i++) {
            index[i] = months.get(i).getYear() * 12L + months.get(i).getMonthValue() - 1;
        }
        double s00 = 0.0;
        double s01 = 0.0;
        double s11 = 0.0;
        for (int i = 0; i < n; i++) {
            double ai = scoreFactor[i];
            double bi = scoreFactor[i] * spread[i];
            s00 += ai * ai;
            s01 += ai * bi;
            s11 += bi * bi;
            for (int j = i + 1; j < n && index[j] - index[i] <= lag; j++) {
                double w = 1.0 - (double) (index[j] - index[i]) / (lag + 1);
                double aj = scoreFactor[j];
                double bj = scoreFactor[j] * spread[j];
                s00 += w * 2.0 * ai * aj;
                s01 += w * (ai * bj + aj * bi);
                s11 += w * 2.0 * bi * bj;
            }
        }
        return sandwich(inverseInfo, s00, s01, s11);
    }

    /** B S B for symmetric 2×2 B = A⁻¹ and S. */
    private static Covariance sandwich(Covariance b, double s00, double s01, double s11) {
        double b00 = b.varAlpha();
        double b01 = b.covAlphaBeta();
        double b11 = b.varBeta();
        // T = B S
        double t00 = b00 * s00 + b01 * s01;
        double t01 = b00 * s01 + b01 * s11;
        double t10 = b01 * s00 + b11 * s01;
        double t11 = b01 * s01 + b11 * s11;
        // V = T B
        double v00 = t00 * b00 + t01 * b01;
        double v01 = t00 * b01 + t01 * b11;
        double v11 = t10 * b01 + t11 * b11;
        return new Covariance(v00, v01, v11);
    }
}
