package org.slopewatch.curve;

import java.util.List;
import java.util.Optional;

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
 * fewer than {@link #MIN_POINTS} get no fit. The betas are solved exactly for any decay parameters
 * ({@link NssProfile}); the decay parameters are found in two steps: a coarse grid over them
 * ({@link DecayGrid}, whose yield-free part is worked out once per set of maturities and kept, with
 * the plan of the maturities' exponentials, {@link Exponentials}) finds the basins of the sum of squares, which has several, and
 * Levenberg–Marquardt ({@link DecaySearch}) descends from the best few grid minima; the best end
 * point wins. A search that does not converge within its caps is dropped; when none converges the
 * result is empty, never an exception.
 *
 * <p>With eleven points the second hump is often barely identified, so nearly equal local minima
 * with different forwards exist; no method short of an exhaustive search is sure to find the
 * global one. The result depends on the snapshot alone (no warm start from an earlier date), so a
 * spread's value never depends on the order quotes arrived in, which replay, revision and recovery
 * rely on.
 */
public final class NssFitter {

    public static final int MIN_POINTS = 4;
    /** Fewest points for which the Svensson form (six parameters) is fitted. */
    public static final int SVENSSON_MIN_POINTS = 6;

    static final int MAX_EVALUATIONS = 200;
    // Grid minima to descend from: the best basin on a coarse grid is nearly always the best one,
    // but two basins of almost equal depth are common on humped curves.
    private static final int MAX_STARTS = 3;
    // A start that already fits this closely cannot be beaten in any sense that matters.
    private static final double GOOD_ENOUGH_RMSE_BP = 1e-6;

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
        DecayGrid grid = DecayGrids.of(years, svensson);
        NssProfile profile = new NssProfile(years, yields, svensson, grid.exponentials());
        DecaySearch.Minimum best = null;
        for (double[] start : grid.starts(yields, MAX_STARTS)) {
            DecaySearch.Minimum minimum = DecaySearch.minimise(profile, start, maxEvaluations);
            if (minimum != null && (best == null || minimum.cost() < best.cost())) {
                best = minimum;
                if (rmse(best.cost(), n) < GOOD_ENOUGH_RMSE_BP) {
                    break;
                }
            }
        }
        if (best == null) {
            return Optional.empty();
        }
        NelsonSiegelSvensson curve = profile.curve(best.logTaus());
        return Optional.of(new NssFit(curve, rmse(best.cost(), n), n, svensson));
    }

    private static double rmse(double sumOfSquares, int points) {
        return Math.sqrt(sumOfSquares / points);
    }
}
