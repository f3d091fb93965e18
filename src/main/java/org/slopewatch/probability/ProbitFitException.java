package org.slopewatch.probability;

/**
 * A probit fit that cannot produce trustworthy coefficients. The message says what was wrong
 * with the data and what to try; {@link #reason()} lets a caller map it to an exit code.
 */
public final class ProbitFitException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /** Why the fit failed. */
    public enum Reason {
        /** Fewer months than the fit and its Newey–West lag need. */
        TOO_FEW_MONTHS,
        /** A spread was NaN or infinite. */
        NON_FINITE_INPUT,
        /** Every month had the same target: no recession ahead anywhere, or everywhere. */
        SINGLE_CLASS,
        /** The spread took one value throughout, so β cannot be told from α. */
        CONSTANT_SPREAD,
        /** A spread threshold splits the two classes exactly (or up to ties): no finite MLE. */
        SEPARATION,
        /** The iterations ran out or the coefficients ran away. */
        NO_CONVERGENCE
    }

    private final Reason reason;

    public ProbitFitException(Reason reason, String message) {
        super(message);
        this.reason = reason;
    }

    public Reason reason() {
        return reason;
    }
}
