package org.slopewatch.curve;

import java.util.Optional;
import org.apache.commons.math3.exception.MathArithmeticException;
import org.apache.commons.math3.exception.MathIllegalArgumentException;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer.Optimum;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.RealVector;

/**
 * Fits a Nelson–Siegel–Svensson curve to the quoted points of a snapshot by least squares,
 * equal weight per point, residuals in basis points.
 *
 * <p>The quoted yields are treated as continuously compounded zero rates at maturity
 * {@link Tenor#years()}. They are in fact par or bond-equivalent yields: the two differ little at
 * the short maturities the near-term forward spread reads and more at the long end, so the long
 * end of a fitted curve is an approximation of the zero curve. Bootstrapping true zero rates would
 * need coupon conventions the quotes do not carry.
 *
 * <p>Six or more points get the six-parameter Svensson form; four or five get plain Nelson–Siegel
 * ({@code beta3 = 0}, {@code tau2 = tau1}), since a second hump cannot be identified from so few;
 * fewer than {@link #MIN_POINTS} get no fit. The decay parameters are searched by
 * Levenberg–Marquardt with the betas solved exactly at each step ({@link NssProfile}). The sum of
 * squares has local minima in the decay parameters, so the search starts from a small grid of
 * them and keeps the best end point. A start that does not converge within the caps is dropped;
 * when none converges the result is empty, never an exception.
 */
public final class NssFitter {

    public static final int MIN_POINTS = 4;
    /** Fewest points for which the Svensson form (six parameters) is fitted. */
    public static final int SVENSSON_MIN_POINTS = 6;

    static final int MAX_EVALUATIONS = 200;
    static final int MAX_ITERATIONS = 100;

    // Starting decay parameters, as ln(years): a short, a medium and a long first hump; the
    // second hump starts further out, where Svensson's extra term usually earns its keep.
    private static final double[][] SVENSSON_STARTS = logGrid(new double[] {0.3, 1.0, 3.0}, new double[] {5.0, 15.0});
    private static final double[][] NELSON_SIEGEL_STARTS = logGrid(new double[] {0.3, 1.0, 3.0, 10.0}, null);
    // A start that already fits this closely cannot be beaten in any sense that matters.
    private static final double GOOD_ENOUGH_RMSE_BP = 1e-6;

    // Immutable, so one instance serves every thread. Relative tolerances of 1e-8 on a cost in bp²
    // stop far below any difference a spread could show, a few iterations sooner than the defaults.
    private static final LevenbergMarquardtOptimizer OPTIMIZER = new LevenbergMarquardtOptimizer()
            .withCostRelativeTolerance(1e-8)
            .withParameterRelativeTolerance(1e-8)
            .withOrthoTolerance(1e-8);

    private NssFitter() {
    }

    /** The fitted curve, or empty with fewer than {@link #MIN_POINTS} points or when no fit converges. */
    public static Optional<NelsonSiegelSvensson> fit(CurveSnapshot snapshot) {
        return fitDetailed(snapshot).map(NssFit::curve);
    }

    /** As {@link #fit(CurveSnapshot)}, with the fit's error and form. */
    public static Optional<NssFit> fitDetailed(CurveSnapshot snapshot) {
        return fitDetailed(snapshot, MAX_EVALUATIONS);
    }

    /** With the evaluation cap as a parameter, so that a test can make every start fail. */
    static Optional<NssFit> fitDetailed(CurveSnapshot snapshot, int maxEvaluations) {
        int n = snapshot.size();
        if (n < MIN_POINTS) {
            return Optional.empty();
        }
        double[] years = new double[n];
        double[] yields = new double[n];
        for (int i = 0; i < n; i++) {
            years[i] = snapshot.tenor(i).years();
            yields[i] = snapshot.yieldBp(i);
            if (!Double.isFinite(yields[i])) {
                return Optional.empty();
            }
        }
        boolean svensson = n >= SVENSSON_MIN_POINTS;
        NssProfile profile = new NssProfile(years, yields, svensson);
        Optimum best = null;
        for (double[] start : svensson ? SVENSSON_STARTS : NELSON_SIEGEL_STARTS) {
            Optimum optimum = run(profile, yields, start, maxEvaluations);
            if (optimum != null && (best == null || optimum.getCost() < best.getCost())) {
                best = optimum;
                if (best.getRMS() < GOOD_ENOUGH_RMSE_BP) {
                    break;
                }
            }
        }
        if (best == null) {
            return Optional.empty();
        }
        NelsonSiegelSvensson curve = profile.curve(best.getPoint().toArray());
        return Optional.of(new NssFit(curve, best.getRMS(), n, svensson));
    }

    /** One search from given log decay parameters; null when it fails or ends somewhere non-finite. */
    private static Optimum run(NssProfile profile, double[] yields, double[] start, int maxEvaluations) {
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .model(profile)
                .parameterValidator(profile)
                .target(yields)
                .start(start)
                .maxEvaluations(maxEvaluations)
                .maxIterations(MAX_ITERATIONS)
                .build();
        try {
            Optimum optimum = OPTIMIZER.optimize(problem);
            RealVector point = optimum.getPoint();
            return point.isNaN() || point.isInfinite() || !Double.isFinite(optimum.getCost()) ? null : optimum;
        } catch (MathIllegalStateException | MathArithmeticException | MathIllegalArgumentException e) {
            // too many evaluations or iterations, or a degenerate step: this start has failed
            return null;
        }
    }

    private static double[][] logGrid(double[] tau1s, double[] tau2s) {
        int per = tau2s == null ? 1 : tau2s.length;
        double[][] grid = new double[tau1s.length * per][];
        int k = 0;
        for (double tau1 : tau1s) {
            if (tau2s == null) {
                grid[k++] = new double[] {Math.log(tau1)};
            } else {
                for (double tau2 : tau2s) {
                    grid[k++] = new double[] {Math.log(tau1), Math.log(tau2)};
                }
            }
        }
        return grid;
    }
}
