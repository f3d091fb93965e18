package org.slopewatch.curve;

/**
 * The Svensson zero-rate curve written out independently of {@link NelsonSiegelSvensson}, so that
 * tests can generate curves and compare fits without trusting the class under test.
 *
 * <p>Source: Nelson, C. R. and Siegel, A. F. (1987), "Parsimonious Modeling of Yield Curves",
 * Journal of Business 60(4); Svensson, L. E. O. (1994), "Estimating and Interpreting Forward
 * Interest Rates: Sweden 1992–1994", NBER Working Paper 4871 (both from memory):
 * <pre>
 * y(t) = b0 + b1·(1 − e^(−t/τ1))/(t/τ1)
 *           + b2·[(1 − e^(−t/τ1))/(t/τ1) − e^(−t/τ1)]
 *           + b3·[(1 − e^(−t/τ2))/(t/τ2) − e^(−t/τ2)]
 * </pre>
 */
record SvenssonFormula(double b0, double b1, double b2, double b3, double tau1, double tau2) {

    /** Plain Nelson–Siegel: no second hump. */
    static SvenssonFormula nelsonSiegel(double b0, double b1, double b2, double tau) {
        return new SvenssonFormula(b0, b1, b2, 0.0, tau, tau);
    }

    double zero(double t) {
        double a = t / tau1;
        double b = t / tau2;
        double slope = (1 - Math.exp(-a)) / a;
        return b0 + b1 * slope + b2 * (slope - Math.exp(-a)) + b3 * ((1 - Math.exp(-b)) / b - Math.exp(-b));
    }

    /** Continuously compounded forward between two maturities: (t2·y(t2) − t1·y(t1)) / (t2 − t1). */
    double forward(double t1, double t2) {
        return (t2 * zero(t2) - t1 * zero(t1)) / (t2 - t1);
    }
}
