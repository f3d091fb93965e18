package org.slopewatch.probability;

/**
 * Settings of a probit fit.
 *
 * @param horizonMonths h: the target for month m is recession in month m + h
 * @param hacLag        Newey–West lag L in months; the horizon by default, because targets of
 *                      months less than h apart look at overlapping windows, which makes their
 *                      errors serially correlated up to about that lag
 * @param maxIterations Fisher-scoring iterations before giving up
 * @param tolerance     convergence when every step is below tolerance·(1 + |coefficient|)
 * @param minMonths     fewest sample months accepted
 */
public record FitOptions(int horizonMonths, int hacLag, int maxIterations, double tolerance, int minMonths) {

    /** Well-behaved probit fits converge in under 15 iterations; 100 leaves room for bad starts. */
    public static final int DEFAULT_MAX_ITERATIONS = 100;
    /** Tight enough that the coefficients are good to about ten digits. */
    public static final double DEFAULT_TOLERANCE = 1e-10;
    /** Two years: fewer months cannot contain both a recession and the run-up to it. */
    public static final int DEFAULT_MIN_MONTHS = 24;

    public FitOptions {
        if (horizonMonths < 0) {
            throw new IllegalArgumentException("horizon must be 0 or more months, got " + horizonMonths);
        }
        if (hacLag < 0) {
            throw new IllegalArgumentException("Newey-West lag must be 0 or more months, got " + hacLag);
        }
        if (maxIterations < 1) {
            throw new IllegalArgumentException("at least one iteration is needed, got " + maxIterations);
        }
        if (!(tolerance > 0.0 && tolerance < 1e-3)) {
            throw new IllegalArgumentException("tolerance must lie in (0, 1e-3), got " + tolerance);
        }
        if (minMonths < 3) {
            throw new IllegalArgumentException("a two-coefficient fit needs at least 3 months, got " + minMonths);
        }
    }

    /** Defaults for a horizon: Newey–West lag = h. */
    public static FitOptions horizon(int horizonMonths) {
        return new FitOptions(horizonMonths, horizonMonths, DEFAULT_MAX_ITERATIONS, DEFAULT_TOLERANCE,
                DEFAULT_MIN_MONTHS);
    }

    public FitOptions withHacLag(int lag) {
        return new FitOptions(horizonMonths, lag, maxIterations, tolerance, minMonths);
    }

    public FitOptions withMinMonths(int months) {
        return new FitOptions(horizonMonths, hacLag, maxIterations, tolerance, months);
    }
}
