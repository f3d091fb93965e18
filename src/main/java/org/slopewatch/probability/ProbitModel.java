package org.slopewatch.probability;

/**
 * A probit recession model: P(recession within the model's horizon) = Φ(α + β·s), with s the
 * term spread in percentage points (normally a calendar-month average).
 *
 * <p>β is negative in every published fit (a flatter or inverted curve means a higher
 * probability), but the record does not insist on it: a desk refitting on its own data should
 * see what its data say.
 *
 * @param alpha      intercept α
 * @param beta       slope β per percentage point of spread
 * @param provenance where the coefficients came from (a paper, a fit and its sample); may be
 *                   empty, never null, because a number without a source is hard to defend in
 *                   a risk report
 */
public record ProbitModel(double alpha, double beta, String provenance) {

    public ProbitModel {
        if (!Double.isFinite(alpha) || !Double.isFinite(beta)) {
            throw new IllegalArgumentException("probit coefficients must be finite, got alpha=" + alpha
                    + " beta=" + beta);
        }
        provenance = provenance == null ? "" : provenance.strip();
    }

    public ProbitModel(double alpha, double beta) {
        this(alpha, beta, "");
    }

    /** The probit index α + β·s. */
    public double index(double spreadPct) {
        requireFinite(spreadPct);
        return alpha + beta * spreadPct;
    }

    /** Φ(α + β·s), the model probability for a spread in percentage points. */
    public double probability(double spreadPct) {
        return Gaussian.cdf(index(spreadPct));
    }

    /**
     * The spread at which the model gives probability p: (Φ⁻¹(p) − α)/β.
     *
     * @throws IllegalArgumentException if p is not strictly between 0 and 1, or β = 0 (then the
     *                                  probability does not depend on the spread at all)
     */
    public double spreadAtProbability(double p) {
        if (beta == 0.0) {
            throw new IllegalArgumentException("beta is 0: the probability does not depend on the spread");
        }
        return (Gaussian.inverseCdf(p) - alpha) / beta;
    }

    /** The spread at which P = 50 %, that is −α/β. */
    public double spreadAtEvenOdds() {
        return spreadAtProbability(0.5);
    }

    private static void requireFinite(double spreadPct) {
        if (!Double.isFinite(spreadPct)) {
            throw new IllegalArgumentException("spread must be a finite number of percentage points, got "
                    + spreadPct);
        }
    }
}
