package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.Objects;

/**
 * The result of a maximum-likelihood probit fit of "recession h months ahead" on the monthly
 * spread.
 *
 * @param alpha                intercept α
 * @param beta                 slope β per percentage point
 * @param modelBased           inverse expected information at the estimate
 * @param neweyWest            Newey–West covariance with lag {@code hacLag} (convention in {@code NeweyWest})
 * @param hacLag               Newey–West lag L in months
 * @param logLikelihood        LL at the estimate
 * @param nullLogLikelihood    LL0 of the intercept-only model, n[ȳ ln ȳ + (1 − ȳ) ln(1 − ȳ)]
 * @param months               n, the number of sample months
 * @param recessionAheadMonths months with y = 1
 * @param horizonMonths        h
 * @param firstMonth           first sample month
 * @param lastMonth            last sample month (its target month is lastMonth + h)
 * @param iterations           Fisher-scoring iterations used
 */
public record ProbitFit(double alpha, double beta, Covariance modelBased, Covariance neweyWest, int hacLag,
                        double logLikelihood, double nullLogLikelihood, int months, int recessionAheadMonths,
                        int horizonMonths, YearMonth firstMonth, YearMonth lastMonth, int iterations) {

    public ProbitFit {
        Objects.requireNonNull(modelBased, "modelBased");
        Objects.requireNonNull(neweyWest, "neweyWest");
        Objects.requireNonNull(firstMonth, "firstMonth");
        Objects.requireNonNull(lastMonth, "lastMonth");
    }

    public Covariance covariance(CovarianceKind kind) {
        return kind == CovarianceKind.NEWEY_WEST ? neweyWest : modelBased;
    }

    public double seAlpha(CovarianceKind kind) {
        return covariance(kind).seAlpha();
    }

    public double seBeta(CovarianceKind kind) {
        return covariance(kind).seBeta();
    }

    /** McFadden's pseudo-R², 1 − LL/LL0. */
    public double mcFaddenR2() {
        return 1.0 - logLikelihood / nullLogLikelihood;
    }

    /**
     * Estrella's (1998) pseudo-R², 1 − (LL/LL0)^(−(2/n)·LL0): 0 for no fit, 1 for a perfect
     * fit, and meant to read like the R² of a linear regression, which McFadden's does not.
     */
    public double estrellaR2() {
        return 1.0 - Math.pow(logLikelihood / nullLogLikelihood, -(2.0 / months) * nullLogLikelihood);
    }

    /** The spread at which the fitted P = 50 %, −α/β. */
    public double spreadAtEvenOdds() {
        return model().spreadAtEvenOdds();
    }

    /** The fitted coefficients as a model, with the sample in its provenance note. */
    public ProbitModel model() {
        return new ProbitModel(alpha, beta, "maximum-likelihood probit fit on " + months + " months "
                + firstMonth + " to " + lastMonth + ", recession " + horizonMonths + " months ahead");
    }

    /**
     * The fitted probability at a spread with a two-sided confidence band (see
     * {@link ProbabilityBand} for the construction).
     *
     * @param level confidence level strictly between 0 and 1, e.g. 0.90
     */
    public ProbabilityBand band(double spreadPct, double level, CovarianceKind kind) {
        Objects.requireNonNull(kind, "kind");
        return ProbabilityBand.of(model(), covariance(kind), kind, spreadPct, level);
    }
}
