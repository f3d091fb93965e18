package org.slopewatch.probability;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.util.FastMath;

/**
 * The standard normal distribution with the tail care a probit likelihood needs.
 *
 * <p>Commons Math evaluates Φ through erfc, which keeps relative accuracy deep into the lower
 * tail but returns exactly 0 below z = −40 (and underflows near −38); taking log of that, or
 * dividing φ by it, would turn one extreme month into −∞ or NaN. Below {@link #TAIL_SWITCH} we
 * therefore use the asymptotic expansion of Mills' ratio instead of the direct ratio.
 */
final class Gaussian {

    /** Below this z, log Φ and φ/Φ come from the asymptotic series (Φ(−37) ≈ 5.7e−300). */
    static final double TAIL_SWITCH = -37.0;

    private static final NormalDistribution STANDARD = new NormalDistribution(null, 0.0, 1.0);
    private static final double LOG_SQRT_2PI = 0.5 * FastMath.log(2.0 * FastMath.PI);

    private Gaussian() {
    }

    static double cdf(double z) {
        return STANDARD.cumulativeProbability(z);
    }

    static double pdf(double z) {
        return FastMath.exp(-0.5 * z * z - LOG_SQRT_2PI);
    }

    /**
     * Φ⁻¹(p) for 0 < p < 1. Commons Math goes through erfInv(2p − 1), so precision fades for p
     * within about 1e−12 of 0 or 1; probabilities a desk asks about are nowhere near that.
     */
    static double inverseCdf(double p) {
        if (!(p > 0.0 && p < 1.0)) {
            throw new IllegalArgumentException("probability must lie strictly between 0 and 1, got " + p);
        }
        return STANDARD.inverseCumulativeProbability(p);
    }

    /** log Φ(z), finite for every finite z. */
    static double logCdf(double z) {
        if (z > 0.0) {
            // Φ(z) = 1 − Φ(−z); log1p keeps the tiny upper-tail mass instead of rounding to log(1).
            return FastMath.log1p(-cdf(-z));
        }
        if (z >= TAIL_SWITCH) {
            return FastMath.log(cdf(z));
        }
        return -0.5 * z * z - LOG_SQRT_2PI - FastMath.log(-z) + FastMath.log(millsSeries(z));
    }

    /**
     * λ(z) = φ(z)/Φ(z), the inverse Mills ratio: the score of a month with y = 1 is λ(η), of a
     * month with y = 0 is −λ(−η). It tends to −z as z → −∞ and to 0 as z → +∞.
     */
    static double inverseMillsRatio(double z) {
        if (z >= TAIL_SWITCH) {
            return pdf(z) / cdf(z);
        }
        return -z / millsSeries(z);
    }

    /**
     * 1 − 1/z² + 3/z⁴ − 15/z⁶ + 105/z⁸, the factor in Φ(z) ≈ φ(z)/(−z) · series for z → −∞;
     * at |z| ≥ 37 the next term (945/z¹⁰) is below 2e−13.
     */
    private static double millsSeries(double z) {
        double r = 1.0 / (z * z);
        return 1.0 - r * (1.0 - r * (3.0 - r * (15.0 - r * 105.0)));
    }
}
