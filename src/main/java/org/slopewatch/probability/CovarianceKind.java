package org.slopewatch.probability;

/** Which covariance of (α, β) a standard error or a confidence band rests on. */
public enum CovarianceKind {

    /**
     * The inverse of the expected (Fisher) information X'WX at the estimate, as R's
     * {@code vcov(glm(...))} reports it. Valid when months are independent, which overlapping
     * horizons make them not: it understates the uncertainty.
     */
    MODEL_BASED("model-based (inverse Fisher information)"),

    /**
     * Newey–West heteroskedasticity-and-autocorrelation-consistent covariance with Bartlett
     * weights; the package-private class {@code NeweyWest} states the exact convention.
     */
    NEWEY_WEST("Newey-West HAC (Bartlett kernel)");

    private final String label;

    CovarianceKind(String label) {
        this.label = label;
    }

    /** A short description for reports, saying which standard errors are shown. */
    public String label() {
        return label;
    }
}
