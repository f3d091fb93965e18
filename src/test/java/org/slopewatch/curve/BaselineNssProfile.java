package org.slopewatch.curve;

/**
 * Test copy of {@link NssProfile} as {@link BaselineNssFitter} used it, kept so that the
 * baseline stays the same whatever the fit's own classes become. Not used by the daemon.
 *
 * <p>The fit with the betas profiled out (variable projection): for fixed decay parameters the
 * curve is linear in the betas, so they are solved exactly by linear least squares, and the
 * optimizer searches over the decay parameters alone.
 *
 * <p>Why: with all six parameters free, the betas and taus trade off along a long, narrow valley
 * and Levenberg–Marquardt needs tens of iterations per start; over one or two parameters it needs
 * a handful, and the valley is gone.
 *
 * <p>Parameters seen by the optimizer: {@code [ln τ1, ln τ2]} (Svensson) or {@code [ln τ1]}
 * (Nelson–Siegel). Logarithms keep the taus positive whatever step is taken. {@link #clamp} also
 * holds each τ between a lower bound and 50 years. The lower bound is 0.05 years, raised so that
 * the hump loading g − e, which peaks at x ≈ 1.7933, peaks no earlier than the shortest quoted
 * maturity: with a smaller τ every quoted point sits on the hump's tail, where slope and hump
 * loadings both fall off like τ/t, the two betas become huge and opposite, and the curve short of
 * the first quote is nonsense. (A very large τ is harmless: the loadings tend to a polynomial in t
 * and the curve stays sensible, though the betas grow.)
 *
 * <p>Model values are the fitted yields; the Jacobian is the exact one of Golub and Pereyra
 * (1973) (from memory):
 * <pre>
 * ∂(Aβ)/∂u = P⊥·(∂A/∂u)·β + Q·R⁻ᵀ·(∂A/∂u)ᵀ·r,   A = QR, P⊥ = I − QQᵀ, r = y − Aβ
 * </pre>
 * Columns of A: 1, g1, g1 − e1 and (Svensson) g2 − e2, with x = t/τ, e = e^(−x), g = (1 − e)/x;
 * ∂g/∂ln τ = g − e and ∂(g − e)/∂ln τ = g − e − x·e.
 *
 * <p>Not thread-safe: scratch arrays are reused across the evaluations of one fit.
 */
final class BaselineNssProfile {

    static final double MIN_TAU = 0.05;
    static final double MAX_TAU = 50.0;
    /** Where the hump loading (1 − e^(−x))/x − e^(−x) peaks: the root of e^(−x)·(1 + x + x²) = 1. */
    static final double HUMP_PEAK_X = 1.7933;
    // A column whose part orthogonal to the others is this small against its length adds nothing
    // they cannot express (as when τ2 = τ1); its beta is held at zero instead of blowing up.
    static final double DEPENDENT = 1e-10;

    private final double[] years;
    private final double[] yields;
    private final boolean svensson;
    private final int n;
    private final int p;
    private final double minLogTau;
    private final double maxLogTau = Math.log(MAX_TAU);

    private final double[][] q;
    private final double[][] r;
    private final boolean[] active;
    private final double[] beta;
    private final double[] residual;
    private final double[] dSlope;   // ∂(g1)/∂ln τ1
    private final double[] dHump1;   // ∂(g1 − e1)/∂ln τ1
    private final double[] dHump2;   // ∂(g2 − e2)/∂ln τ2
    private final double[] w;
    private final double[] z;
    private final double[] v;

    BaselineNssProfile(double[] years, double[] yields, boolean svensson) {
        this.years = years;
        this.yields = yields;
        this.svensson = svensson;
        this.n = years.length;
        this.p = svensson ? 4 : 3;
        double shortest = Double.POSITIVE_INFINITY;
        for (double t : years) {
            shortest = Math.min(shortest, t);
        }
        this.minLogTau = Math.log(Math.max(MIN_TAU, shortest / HUMP_PEAK_X));
        this.q = new double[p][n];
        this.r = new double[p][p];
        this.active = new boolean[p];
        this.beta = new double[p];
        this.residual = new double[n];
        this.dSlope = new double[n];
        this.dHump1 = new double[n];
        this.dHump2 = new double[n];
        this.w = new double[p];
        this.z = new double[p];
        this.v = new double[n];
    }

    /** Number of nonlinear parameters: the log decay parameters. */
    int parameterCount() {
        return svensson ? 2 : 1;
    }

    /** The curve for given log decay parameters, with its betas solved. */
    NelsonSiegelSvensson curve(double[] logTaus) {
        double tau1 = Math.exp(logTaus[0]);
        double tau2 = svensson ? Math.exp(logTaus[1]) : tau1;
        solve(tau1, tau2);
        return new NelsonSiegelSvensson(beta[0], beta[1], beta[2], svensson ? beta[3] : 0.0, tau1, tau2);
    }

    /** Solves the betas at given log decay parameters; the sum of squared residuals in bp². */
    double cost(double[] logTaus) {
        double tau1 = Math.exp(logTaus[0]);
        double tau2 = svensson ? Math.exp(logTaus[1]) : tau1;
        solve(tau1, tau2);
        return dot(residual, residual);
    }

    /**
     * The Jacobian of the fitted yields with respect to the log decay parameters, at the point of
     * the last {@link #cost} call, into {@code out} (n rows, {@link #parameterCount()} columns).
     */
    void jacobian(double[][] out) {
        jacobianColumn(out, 0, beta[1], dSlope, beta[2], dHump1, 1, 2);
        if (svensson) {
            jacobianColumn(out, 1, 0.0, null, beta[3], dHump2, -1, 3);
        }
    }

    /** The residuals y − ŷ at the point of the last {@link #cost} call (shared scratch: do not keep). */
    double[] residuals() {
        return residual;
    }

    int points() {
        return n;
    }

    /** Holds each log decay parameter inside its bounds (see the class comment); NaN goes to the lower one. */
    void clamp(double[] logTaus) {
        for (int k = 0; k < logTaus.length; k++) {
            double u = logTaus[k];
            if (!(u >= minLogTau)) {
                logTaus[k] = minLogTau;
            } else if (u > maxLogTau) {
                logTaus[k] = maxLogTau;
            }
        }
    }

    double minLogTau() {
        return minLogTau;
    }

    double maxLogTau() {
        return maxLogTau;
    }

    /** The smallest τ the fit may use for these maturities, in years. */
    double minTau() {
        return Math.exp(minLogTau);
    }

    /**
     * Fills the design, its QR factors, the betas, the residuals and the column derivatives.
     * Column k of A goes into q[k] and is orthogonalised in place (Gram–Schmidt, two passes,
     * since the NSS columns can be close to collinear and one pass loses orthogonality).
     */
    private void solve(double tau1, double tau2) {
        for (int i = 0; i < n; i++) {
            double x1 = years[i] / tau1;
            double e1 = Math.exp(-x1);
            double g1 = loading(x1, e1);
            q[0][i] = 1.0;
            q[1][i] = g1;
            q[2][i] = g1 - e1;
            dSlope[i] = g1 - e1;
            dHump1[i] = g1 - e1 - x1 * e1;
            if (svensson) {
                double x2 = years[i] / tau2;
                double e2 = Math.exp(-x2);
                q[3][i] = loading(x2, e2) - e2;
                dHump2[i] = q[3][i] - x2 * e2;
            }
        }
        for (int k = 0; k < p; k++) {
            double[] col = q[k];
            double length = norm(col);
            for (int j = 0; j < k; j++) {
                r[j][k] = 0.0;
            }
            for (int pass = 0; pass < 2; pass++) {
                for (int j = 0; j < k; j++) {
                    if (active[j]) {
                        double c = dot(q[j], col);
                        r[j][k] += c;
                        axpy(-c, q[j], col);
                    }
                }
            }
            double rest = norm(col);
            active[k] = rest > DEPENDENT * length;
            r[k][k] = active[k] ? rest : 0.0;
            for (int i = 0; i < n; i++) {
                col[i] = active[k] ? col[i] / rest : 0.0;
            }
        }
        // betas from R·β = Qᵀy; residual = y − QQᵀy
        System.arraycopy(yields, 0, residual, 0, n);
        for (int k = 0; k < p; k++) {
            w[k] = dot(q[k], yields);
            axpy(-w[k], q[k], residual);
        }
        for (int k = p - 1; k >= 0; k--) {
            if (!active[k]) {
                beta[k] = 0.0;
                continue;
            }
            double s = w[k];
            for (int j = k + 1; j < p; j++) {
                s -= r[k][j] * beta[j];
            }
            beta[k] = s / r[k][k];
        }
    }

    /**
     * One column of the Jacobian: v = (∂A/∂u)·β is c1·d1 + c2·d2; the columns of A it touches are
     * k1 and k2 (k1 = −1 when only one is touched).
     */
    private void jacobianColumn(double[][] jacobian, int col, double c1, double[] d1, double c2, double[] d2, int k1, int k2) {
        for (int i = 0; i < n; i++) {
            v[i] = c2 * d2[i] + (d1 == null ? 0.0 : c1 * d1[i]);
        }
        // P⊥·v
        for (int k = 0; k < p; k++) {
            axpy(-dot(q[k], v), q[k], v);
        }
        // z = R⁻ᵀ·w with w = (∂A/∂u)ᵀ·r, non-zero only in the touched columns
        for (int k = 0; k < p; k++) {
            w[k] = 0.0;
        }
        if (k1 >= 0) {
            w[k1] = dot(d1, residual);
        }
        w[k2] = dot(d2, residual);
        for (int k = 0; k < p; k++) {
            if (!active[k]) {
                z[k] = 0.0;
                continue;
            }
            double s = w[k];
            for (int j = 0; j < k; j++) {
                s -= r[j][k] * z[j];
            }
            z[k] = s / r[k][k];
        }
        for (int i = 0; i < n; i++) {
            double qz = 0.0;
            for (int k = 0; k < p; k++) {
                qz += q[k][i] * z[k];
            }
            jacobian[i][col] = v[i] + qz;
        }
    }

    /**
     * (1 − e^(−x))/x from an already computed e^(−x), one transcendental call per point since
     * this runs for every point at every evaluation. {@code Math.exp} rather than
     * {@code Math.expm1}, which is several times slower: the subtraction 1 − e^(−x) loses about
     * 1e-16/x relative, under 1e-13 above the series' range, far below anything a fit can show.
     */
    static double loading(double x, double exp) {
        if (x < 1e-3) {
            return 1 - x / 2 + x * x / 6 - x * x * x / 24; // error below x⁴/120
        }
        return (1.0 - exp) / x;
    }

    static double dot(double[] a, double[] b) {
        double s = 0.0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    static void axpy(double c, double[] x, double[] y) {
        for (int i = 0; i < y.length; i++) {
            y[i] += c * x[i];
        }
    }

    static double norm(double[] a) {
        return Math.sqrt(dot(a, a));
    }
}
