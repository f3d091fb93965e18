package org.slopewatch.probability;

/**
 * A model probability at one spread with its confidence band.
 *
 * <p>The band comes from the delta method on the index η = α + β·s, whose variance is exact for
 * a linear combination, then mapped through Φ: [Φ(η − z·se(η)), Φ(η + z·se(η))]. That stays
 * inside [0, 1] and is lopsided near the ends, as a probability's uncertainty is; the symmetric
 * delta-method band on P itself, P ± z·φ(η)·se(η), can leave [0, 1] when P is small, which is
 * exactly where a desk looks. {@link #seProbability()} is that delta-method standard error of P,
 * for readers who want it.
 *
 * @param level      confidence level, e.g. 0.90
 * @param covariance which covariance of (α, β) the band rests on; null when given from outside (a policy) without saying
 */
public record ProbabilityBand(double spreadPct, double probability, double lower, double upper,
                              double seProbability, double level, CovarianceKind covariance) {

    /**
     * The band of a model at a spread, given a covariance of its coefficients.
     *
     * @param level confidence level strictly between 0 and 1, e.g. 0.90
     */
    public static ProbabilityBand of(ProbitModel model, Covariance cov, CovarianceKind kind, double spreadPct, double level) {
        if (!(level > 0.0 && level < 1.0)) {
            throw new IllegalArgumentException("confidence level must lie strictly between 0 and 1, got " + level);
        }
        double eta = model.index(spreadPct);
        double seIndex = Math.sqrt(cov.indexVariance(spreadPct));
        double z = Gaussian.inverseCdf(0.5 + level / 2.0);
        return new ProbabilityBand(spreadPct, Gaussian.cdf(eta), Gaussian.cdf(eta - z * seIndex), Gaussian.cdf(eta + z * seIndex),
                Gaussian.pdf(eta) * seIndex, level, kind);
    }
}
