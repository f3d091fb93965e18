package org.slopewatch.curve;

/**
 * The fit with the betas profiled out (variable projection): for fixed decay parameters the
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
 * <p>Every search step evaluates it, so it is written for the count of operations: the constant
 * column is handled as a mean, the exponentials come from {@link Exponentials}, Gram–Schmidt and
 * the Jacobian gather their sums in a few sweeps over the points, and a Gauss–Newton step gets JᵀJ
 * and Jᵀr ({@link #normalEquations}) without the Jacobian stored.
 *
 * <p>Not thread-safe: scratch arrays are reused across the evaluations of one fit.
 */
final class NssProfile {

    static final double MIN_TAU = 0.05;
    static final double MAX_TAU = 50.0;
    /** Where the hump loading (1 − e^(−x))/x − e^(−x) peaks: the root of e^(−x)·(1 + x + x²) = 1. */
    static final double HUMP_PEAK_X = 1.7933;
    // A column whose part orthogonal to the others is this small against its length adds nothing
    // they cannot express (as when τ2 = τ1); its beta is held at zero instead of blowing up.
    static final double DEPENDENT = 1e-10;
    // below this x the loading's quotient loses precision and its series takes over
    private static final double SERIES_BELOW = 1e-3;

    private final double[] years;
    private final double[] yields;
    private final boolean svensson;
    private final int n;
    private final int p;
    private final double minLogTau;
    private final double maxLogTau = highestLogTau();

    private final double[][] q;
    private final double[][] r;
    private final boolean[] active;
    private final double[] beta;
    private final double[] residual;
    private final double[] dSlope;   // ∂(g1)/∂ln τ1
    private final double[] dHump1;   // ∂(g1 − e1)/∂ln τ1
    private final double[] dHump2;   // ∂(g2 − e2)/∂ln τ2
    private final double[] w;
    // per profile: 1/t, √n, 1/√n, 1/n, the yields less their mean and Σy/√n (Qᵀy's constant entry)
    private final double[] inverseYears;
    private final Exponentials exponentials;
    private final double[] exp1;
    private final double[] exp2;
    private final double rootN;
    private final double inverseRootN;
    private final double inverseN;
    private final double[] centredYields;
    private final double yieldSumScaled;

    NssProfile(double[] years, double[] yields, boolean svensson) {
        this(years, yields, svensson, Exponentials.of(years));
    }

    /** With the exponentials' plan of these maturities, as kept by their {@link DecayGrid}. */
    NssProfile(double[] years, double[] yields, boolean svensson, Exponentials exponentials) {
        this.years = years;
        this.exponentials = exponentials;
        this.exp1 = new double[years.length];
        this.exp2 = new double[years.length];
        this.yields = yields;
        this.svensson = svensson;
        this.n = years.length;
        this.p = svensson ? 4 : 3;
        this.minLogTau = lowestLogTau(years);
        this.q = new double[p][n];
        this.r = new double[p][p];
        this.active = new boolean[p];
        active[0] = true; // the constant column, never dependent on nothing
        this.beta = new double[p];
        this.residual = new double[n];
        this.dSlope = new double[n];
        this.dHump1 = new double[n];
        this.dHump2 = new double[n];
        this.w = new double[p];
        this.inverseYears = new double[n];
        for (int i = 0; i < n; i++) {
            inverseYears[i] = 1.0 / years[i];
        }
        this.rootN = Math.sqrt(n);
        this.inverseRootN = 1.0 / rootN;
        this.inverseN = 1.0 / n;
        double sum = 0.0;
        for (double y : yields) {
            sum += y;
        }
        this.yieldSumScaled = sum * inverseRootN;
        this.centredYields = yields.clone();
        for (int pass = 0; pass < 2; pass++) {
            double rest = 0.0;
            for (double y : centredYields) {
                rest += y;
            }
            double mean = rest * inverseN;
            for (int i = 0; i < n; i++) {
                centredYields[i] -= mean;
            }
        }
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
        fillJacobian(out, null, null);
    }

    /**
     * JᵀJ and Jᵀr at the point of the last {@link #cost} call, J as in {@link #jacobian}: what a
     * Gauss–Newton step needs, without the Jacobian stored in between.
     */
    void normalEquations(double[][] normal, double[] gradient) {
        fillJacobian(null, normal, gradient);
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

    /** The lower bound on ln τ for these maturities (see the class comment). */
    static double lowestLogTau(double[] years) {
        double shortest = Double.POSITIVE_INFINITY;
        for (double t : years) {
            shortest = Math.min(shortest, t);
        }
        return Math.log(Math.max(MIN_TAU, shortest / HUMP_PEAK_X));
    }

    /** The upper bound on ln τ. */
    static double highestLogTau() {
        return Math.log(MAX_TAU);
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
     *
     * <p>Written for the number of operations, since it runs at every step of every search: the
     * first column is the constant, so its unit vector is 1/√n everywhere and projecting on it is
     * taking the mean (q[0] is never read); divisions by τ, t and a column's length are
     * multiplications by reciprocals; the yields' own mean is taken out once per profile.
     */
    private void solve(double tau1, double tau2) {
        double inverse1 = 1.0 / tau1;
        double inverse2 = 1.0 / tau2;
        exponentials.fill(inverse1, exp1);
        if (svensson) {
            exponentials.fill(inverse2, exp2);
        }
        for (int i = 0; i < n; i++) {
            double x1 = years[i] * inverse1;
            double e1 = exp1[i];
            double g1 = x1 < SERIES_BELOW ? series(x1) : (1.0 - e1) * tau1 * inverseYears[i];
            double h1 = g1 - e1;
            q[1][i] = g1;
            q[2][i] = h1;
            dSlope[i] = h1;
            dHump1[i] = h1 - x1 * e1;
            if (svensson) {
                double x2 = years[i] * inverse2;
                double e2 = exp2[i];
                double h2 = (x2 < SERIES_BELOW ? series(x2) : (1.0 - e2) * tau2 * inverseYears[i]) - e2;
                q[3][i] = h2;
                dHump2[i] = h2 - x2 * e2;
            }
        }
        r[0][0] = rootN;
        for (int k = 1; k < p; k++) {
            orthonormalise(k);
        }
        // betas from R·β = Qᵀy; residual = y − QQᵀy, from the centred yields (Qᵀy's first entry is kept)
        w[0] = yieldSumScaled;
        double w1 = 0.0;
        double w2 = 0.0;
        double w3 = 0.0;
        double[] q1 = q[1];
        double[] q2 = q[2];
        double[] q3 = q[p - 1];
        for (int i = 0; i < n; i++) {
            double y = centredYields[i];
            w1 += q1[i] * y;
            w2 += q2[i] * y;
            w3 += q3[i] * y;
        }
        w[1] = w1;
        w[2] = w2;
        if (!svensson) {
            w3 = 0.0;
        } else {
            w[3] = w3;
        }
        for (int i = 0; i < n; i++) {
            residual[i] = centredYields[i] - w1 * q1[i] - w2 * q2[i] - (svensson ? w3 * q3[i] : 0.0);
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
     * Column k of the design, in q[k], made orthogonal to the constant and to q[1..k−1] and of
     * unit length, its coefficients into R. Classical Gram–Schmidt applied twice ("twice is
     * enough": as stable as the modified form applied twice), which gathers every projection of a
     * pass in one sweep over the points and subtracts them in a second.
     */
    private void orthonormalise(int k) {
        double[] col = q[k];
        double[] q1 = q[1];
        double[] q2 = q[2];
        double squared = 0.0;
        for (int i = 0; i < n; i++) {
            squared += col[i] * col[i];
        }
        double length = Math.sqrt(squared);
        for (int j = 0; j < k; j++) {
            r[j][k] = 0.0;
        }
        for (int pass = 0; pass < 2; pass++) {
            double sum = 0.0;
            double c1 = 0.0;
            double c2 = 0.0;
            for (int i = 0; i < n; i++) {
                double v = col[i];
                sum += v;
                c1 += q1[i] * v;
                c2 += q2[i] * v;
            }
            // only the earlier, independent columns count; q1 and q2 are zero where inactive
            c1 = k > 1 && active[1] ? c1 : 0.0;
            c2 = k > 2 && active[2] ? c2 : 0.0;
            r[0][k] += sum * inverseRootN;
            if (k > 1) {
                r[1][k] += c1;
            }
            if (k > 2) {
                r[2][k] += c2;
            }
            double mean = sum * inverseN;
            for (int i = 0; i < n; i++) {
                col[i] -= mean + c1 * q1[i] + c2 * q2[i];
            }
        }
        double restSquared = 0.0;
        for (int i = 0; i < n; i++) {
            restSquared += col[i] * col[i];
        }
        double rest = Math.sqrt(restSquared);
        active[k] = rest > DEPENDENT * length;
        r[k][k] = active[k] ? rest : 0.0;
        double scale = active[k] ? 1.0 / rest : 0.0;
        for (int i = 0; i < n; i++) {
            col[i] *= scale;
        }
    }

    /**
     * Both columns of the Jacobian in two sweeps over the points. For ln τ1, v = β1·∂g1 + β2·∂h1
     * touches columns 1 and 2 of A; for ln τ2, v = β3·∂h2 touches column 3. P⊥·v is v less its
     * mean less its projections on q1..q3, all gathered in the first sweep; z = R⁻ᵀ·(∂A/∂u)ᵀ·r
     * has no entry on the constant column (r sums to zero), so Q·z needs only q1..q3.
     */
    private void fillJacobian(double[][] jacobian, double[][] normal, double[] gradient) {
        double b1 = beta[1];
        double b2 = beta[2];
        double b3 = svensson ? beta[3] : 0.0;
        double sum1 = 0.0;
        double sum2 = 0.0;
        double q1v1 = 0.0;
        double q2v1 = 0.0;
        double q3v1 = 0.0;
        double q3v2 = 0.0;
        double q1v2 = 0.0;
        double q2v2 = 0.0;
        double w1 = 0.0;
        double w2 = 0.0;
        double w3 = 0.0;
        double[] q1 = q[1];
        double[] q2 = q[2];
        double[] q3 = svensson ? q[3] : q[2];
        for (int i = 0; i < n; i++) {
            double v1 = b1 * dSlope[i] + b2 * dHump1[i];
            double v2 = b3 * dHump2[i];
            sum1 += v1;
            sum2 += v2;
            q1v1 += q1[i] * v1;
            q2v1 += q2[i] * v1;
            q3v1 += q3[i] * v1;
            q1v2 += q1[i] * v2;
            q2v2 += q2[i] * v2;
            q3v2 += q3[i] * v2;
            w1 += dSlope[i] * residual[i];
            w2 += dHump1[i] * residual[i];
            w3 += dHump2[i] * residual[i];
        }
        // z = R⁻ᵀ·w, forward substitution over the active columns; w has no entry on column 0
        double z1 = active[1] ? w1 / r[1][1] : 0.0;
        double z2 = active[2] ? (w2 - r[1][2] * z1) / r[2][2] : 0.0;
        double z3 = 0.0;
        double u3 = 0.0;
        if (svensson) {
            z3 = active[3] ? (-r[1][3] * z1 - r[2][3] * z2) / r[3][3] : 0.0;
            u3 = active[3] ? w3 / r[3][3] : 0.0;
        } else {
            q3v1 = 0.0;
        }
        double mean1 = sum1 * inverseN;
        double mean2 = sum2 * inverseN;
        double j11 = 0.0;
        double j12 = 0.0;
        double j22 = 0.0;
        double g1 = 0.0;
        double g2 = 0.0;
        for (int i = 0; i < n; i++) {
            double q3i = svensson ? q3[i] : 0.0;
            double v1 = b1 * dSlope[i] + b2 * dHump1[i];
            double a1 = v1 - mean1 - q1v1 * q1[i] - q2v1 * q2[i] - q3v1 * q3i + z1 * q1[i] + z2 * q2[i] + z3 * q3i;
            double a2 = 0.0;
            if (svensson) {
                double v2 = b3 * dHump2[i];
                a2 = v2 - mean2 - q1v2 * q1[i] - q2v2 * q2[i] - q3v2 * q3i + u3 * q3i;
            }
            if (jacobian != null) {
                jacobian[i][0] = a1;
                if (svensson) {
                    jacobian[i][1] = a2;
                }
            } else {
                j11 += a1 * a1;
                j12 += a1 * a2;
                j22 += a2 * a2;
                g1 += a1 * residual[i];
                g2 += a2 * residual[i];
            }
        }
        if (normal != null) {
            normal[0][0] = j11;
            gradient[0] = g1;
            if (svensson) {
                normal[0][1] = j12;
                normal[1][0] = j12;
                normal[1][1] = j22;
                gradient[1] = g2;
            }
        }
    }

    private static double series(double x) {
        return 1 - x / 2 + x * x / 6 - x * x * x / 24; // error below x⁴/120
    }

    /**
     * (1 − e^(−x))/x from an already computed e^(−x), one transcendental call per point since
     * this runs for every point at every evaluation. {@code Math.exp} rather than
     * {@code Math.expm1}, which is several times slower: the subtraction 1 − e^(−x) loses about
     * 1e-16/x relative, under 1e-13 above the series' range, far below anything a fit can show.
     */
    static double loading(double x, double exp) {
        return x < SERIES_BELOW ? series(x) : (1.0 - exp) / x;
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
