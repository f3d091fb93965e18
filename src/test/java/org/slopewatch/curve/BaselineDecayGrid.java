package org.slopewatch.curve;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * Test copy of {@link DecayGrid} as it was before the decay grid was kept per set of maturities,
 * the reference that the fit and its benchmark are compared against. Not used by the daemon.
 *
 * <p>The coarse half of the fit: the profiled sum of squares on a log-spaced grid of decay
 * parameters, whose best local minima become the starting points of the local search.
 *
 * <p>Why a grid rather than a few fixed starts: the sum of squares has several basins in
 * (τ1, τ2), and which ones, and where, depends on the curve; fixed starts can all fall into the
 * wrong one, and each costs a full local search. The grid sees every basin at a fraction of one
 * search, because the loadings of each grid τ are computed once rather than once per cell, and
 * for a fixed τ1 the first three columns (level, slope, first hump) are factored once for all
 * τ2, leaving one column to orthogonalise per cell.
 */
final class BaselineDecayGrid {

    // Grid values per decay parameter, evenly spaced in ln τ between the profile's bounds: about a
    // factor of 1.6 apart in τ for Svensson's two; twice as fine for Nelson–Siegel's one, where a
    // finer grid is cheap and basins can sit close together.
    static final int SVENSSON_POINTS = 16;
    static final int NELSON_SIEGEL_POINTS = 32;
    // |h⊥|²/|h|² below this: h is taken as dependent on the first three columns (|h⊥|/|h| < 1e-4)
    private static final double NEARLY_DEPENDENT = 1e-8;

    private BaselineDecayGrid() {
    }

    /**
     * Up to {@code maxStarts} grid points that are local minima of the sum of squares (no lower
     * neighbour), best first, as log decay parameters.
     */
    static List<double[]> starts(BaselineNssProfile profile, double[] years, double[] yields, boolean svensson, int maxStarts) {
        int n = years.length;
        int points = svensson ? SVENSSON_POINTS : NELSON_SIEGEL_POINTS;
        double[] logTau = new double[points];
        double[][] slope = new double[points][n];
        double[][] hump = new double[points][n];
        for (int k = 0; k < points; k++) {
            logTau[k] = profile.minLogTau() + (profile.maxLogTau() - profile.minLogTau()) * k / (points - 1);
            double tau = Math.exp(logTau[k]);
            for (int i = 0; i < n; i++) {
                double x = years[i] / tau;
                double e = Math.exp(-x);
                slope[k][i] = BaselineNssProfile.loading(x, e);
                hump[k][i] = slope[k][i] - e;
            }
        }
        double[][] cost = new double[points][svensson ? points : 1];
        double[][] q = new double[3][n];
        boolean[] active = new boolean[3];
        double[] residual = new double[n];
        double[] humpSquared = new double[points];
        for (int k = 0; k < points; k++) {
            humpSquared[k] = BaselineNssProfile.dot(hump[k], hump[k]);
        }
        for (int a = 0; a < points; a++) {
            Arrays.fill(q[0], 1.0);
            System.arraycopy(slope[a], 0, q[1], 0, n);
            System.arraycopy(hump[a], 0, q[2], 0, n);
            for (int k = 0; k < 3; k++) {
                active[k] = orthonormalise(q[k], q, active, k);
            }
            System.arraycopy(yields, 0, residual, 0, n);
            for (int k = 0; k < 3; k++) {
                BaselineNssProfile.axpy(-BaselineNssProfile.dot(q[k], yields), q[k], residual);
            }
            double base = BaselineNssProfile.dot(residual, residual);
            if (!svensson) {
                cost[a][0] = base;
                continue;
            }
            for (int b = 0; b < points; b++) {
                cost[a][b] = base - reduction(hump[b], humpSquared[b], q, active, residual);
            }
        }
        return localMinima(cost, logTau, svensson, maxStarts);
    }

    /**
     * Orthogonalises {@code column} against the first {@code count} active columns of {@code q}
     * (two Gram–Schmidt passes, as in {@link BaselineNssProfile}) and normalises it; false when nothing
     * independent of them is left, in which case the column is zeroed.
     */
    private static boolean orthonormalise(double[] column, double[][] q, boolean[] active, int count) {
        double length = BaselineNssProfile.norm(column);
        for (int pass = 0; pass < 2; pass++) {
            for (int j = 0; j < count; j++) {
                if (active[j]) {
                    BaselineNssProfile.axpy(-BaselineNssProfile.dot(q[j], column), q[j], column);
                }
            }
        }
        double rest = BaselineNssProfile.norm(column);
        boolean independent = rest > BaselineNssProfile.DEPENDENT * length;
        for (int i = 0; i < column.length; i++) {
            column[i] = independent ? column[i] / rest : 0.0;
        }
        return independent;
    }

    /**
     * How much adding column h to the fit of the first three (orthonormal q, residual r ⟂ q)
     * lowers the sum of squares: (hᵀr)² / |h⊥|², with |h⊥|² = hᵀh − Σ(qⱼᵀh)². Four dot products
     * instead of orthogonalising h; the subtraction loses precision when h is nearly in the span
     * of q (τ2 near τ1), so such a column counts as adding nothing, which only makes the coarse
     * grid slightly pessimistic there.
     */
    private static double reduction(double[] h, double hh, double[][] q, boolean[] active, double[] residual) {
        double rest = hh;
        for (int j = 0; j < q.length; j++) {
            if (active[j]) {
                double c = BaselineNssProfile.dot(q[j], h);
                rest -= c * c;
            }
        }
        if (!(rest > NEARLY_DEPENDENT * hh)) {
            return 0.0;
        }
        double hr = BaselineNssProfile.dot(h, residual);
        return Math.min(hr * hr / rest, Double.MAX_VALUE);
    }

    private static List<double[]> localMinima(double[][] cost, double[] logTau, boolean svensson, int maxStarts) {
        List<double[]> minima = new ArrayList<>();
        int columns = cost[0].length;
        for (int a = 0; a < cost.length; a++) {
            for (int b = 0; b < columns; b++) {
                if (noLowerNeighbour(cost, a, b)) {
                    minima.add(svensson ? new double[] {logTau[a], logTau[b], cost[a][b]} : new double[] {logTau[a], cost[a][b]});
                }
            }
        }
        int last = svensson ? 2 : 1;
        minima.sort(Comparator.comparingDouble(m -> m[last]));
        List<double[]> starts = new ArrayList<>(Math.min(maxStarts, minima.size()));
        for (double[] m : minima.subList(0, Math.min(maxStarts, minima.size()))) {
            starts.add(Arrays.copyOf(m, last));
        }
        return starts;
    }

    private static boolean noLowerNeighbour(double[][] cost, int a, int b) {
        double here = cost[a][b];
        if (!Double.isFinite(here)) {
            return false;
        }
        for (int da = -1; da <= 1; da++) {
            for (int db = -1; db <= 1; db++) {
                int na = a + da;
                int nb = b + db;
                if ((da != 0 || db != 0) && na >= 0 && na < cost.length && nb >= 0 && nb < cost[0].length
                        && cost[na][nb] < here) {
                    return false;
                }
            }
        }
        return true;
    }
}
