package org.slopewatch.curve;

import java.util.List;
import java.util.Optional;

/**
 * Test copy of {@link NssFitter} as it was before the decay grid was kept per set of maturities,
 * the reference that the fit and its benchmark are compared against. Not used by the daemon.
 *
 * <p>Fits a Nelson–Siegel–Svensson curve to the quoted points of a snapshot by least squares,
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
 * ({@link BaselineNssProfile}); the decay parameters are found in two steps: a coarse grid over them
 * ({@link DecayGrid}) finds the basins of the sum of squares, which has several, and
 * Levenberg–Marquardt ({@link BaselineDecaySearch}) descends from the best few grid minima; the best end
 * point wins. A search that does not converge within its caps is dropped; when none converges the
 * result is empty, never an exception.
 *
 * <p>With eleven points the second hump is often barely identified, so nearly equal local minima
 * with different forwards exist; no method short of an exhaustive search is sure to find the
 * global one. The result depends on the snapshot alone (no warm start from an earlier date), so a
 * spread's value never depends on the order quotes arrived in, which replay, revision and recovery
 * rely on.
 */
public final class BaselineNssFitter {

    public static final int MIN_POINTS = 4;
    /** Fewest points for which the Svensson form (six parameters) is fitted. */
    public static final int SVENSSON_MIN_POINTS = 6;

    static final int MAX_EVALUATIONS = 200;
    // Grid minima to descend from: the best basin on a coarse grid is nearly always the best one,
    // but two basins of almost equal depth are common on humped curves.
    private static final int MAX_STARTS = 3;
    // A start that already fits this closely cannot be beaten in any sense that matters.
    private static final double GOOD_ENOUGH_RMSE_BP = 1e-6;

    private BaselineNssFitter() {
    }

    /** The fitted curve, or empty with fewer than {@link #MIN_POINTS} points or when no fit converges. */
    public static Optional<NelsonSiegelSvensson> fit(CurveSnapshot snapshot) {
        return fitDetailed(snapshot).map(NssFit::curve);
    }

    /** As {@link #fit(CurveSnapshot)}, with the fit's error and form. */
    public static Optional<NssFit> fitDetailed(CurveSnapshot snapshot) {
        return fitDetailed(snapshot, MAX_EVALUATIONS);
    }

    /**
     * The fit as it was before its descent changed: this baseline's descent from the starts of the
     * decay grid kept per set of maturities ({@link DecayGrids}), which are this baseline's starts
     * to the last bit (NssFitterAgainstBaselineTest checked that while the two were one). For the
     * benchmark of the descent alone.
     */
    public static Optional<NssFit> fitDetailedWithKeptGrid(CurveSnapshot snapshot) {
        return fitDetailed(snapshot, MAX_EVALUATIONS, true);
    }

    /** With the evaluation cap as a parameter, so that a test can make every start fail. */
    static Optional<NssFit> fitDetailed(CurveSnapshot snapshot, int maxEvaluations) {
        return fitDetailed(snapshot, maxEvaluations, false);
    }

    private static Optional<NssFit> fitDetailed(CurveSnapshot snapshot, int maxEvaluations, boolean keptGrid) {
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
        BaselineNssProfile profile = new BaselineNssProfile(years, yields, svensson);
        BaselineDecaySearch.Minimum best = null;
        List<double[]> starts = keptGrid ? DecayGrids.of(years, svensson).starts(yields, MAX_STARTS)
                : BaselineDecayGrid.starts(profile, years, yields, svensson, MAX_STARTS);
        for (double[] start : starts) {
            BaselineDecaySearch.Minimum minimum = BaselineDecaySearch.minimise(profile, start, maxEvaluations);
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
