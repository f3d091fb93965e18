package org.slopewatch.curve;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * The coarse half of the fit: the profiled sum of squares on a log-spaced grid of decay
 * parameters, whose best local minima become the starting points of the local search.
 *
 * <p>Why a grid rather than a few fixed starts: the sum of squares has several basins in
 * (τ1, τ2), and which ones, and where, depends on the curve; fixed starts can all fall into the
 * wrong one, and each costs a full local search. The grid sees every basin at a fraction of one
 * search.
 *
 * <p>Everything on the grid that does not depend on the yields is worked out once per set of
 * maturities, when the grid is built, and kept (see {@link DecayGrids}): the loadings of each grid
 * τ, for each τ1 the first three columns (level, slope, first hump) orthonormalised, and for each
 * cell the part of the second hump's column orthogonal to them. A snapshot then costs, per τ1,
 * projecting its yields on three columns, and per cell one dot product. The arithmetic is the
 * same, operation for operation, as when all of it was redone for every snapshot, so the starts,
 * and the fit, are the same to the last bit.
 *
 * <p>Immutable once built, so one grid serves every thread.
 */
final class DecayGrid {

    // Grid values per decay parameter, evenly spaced in ln τ between the profile's bounds: about a
    // factor of 1.6 apart in τ for Svensson's two; twice as fine for Nelson–Siegel's one, where a
    // finer grid is cheap and basins can sit close together.
    static final int SVENSSON_POINTS = 16;
    static final int NELSON_SIEGEL_POINTS = 32;
    // |h⊥|²/|h|² below this: h is taken as dependent on the first three columns (|h⊥|/|h| < 1e-4)
    private static final double NEARLY_DEPENDENT = 1e-8;

    private final int n;
    private final boolean svensson;
    private final Exponentials exponentials;
    private final double[] logTau;
    private final double[][] hump;
    // per τ1 (first index): the three orthonormalised columns and which of them are independent
    private final double[][][] q;
    private final boolean[][] active;
    // per cell: |h⊥|² of the second hump's column, or NaN where it counts as adding nothing
    private final double[][] rest;

    /** The grid for quoted maturities {@code years}, between the profile's bounds on ln τ. */
    DecayGrid(double[] years, double minLogTau, double maxLogTau, boolean svensson) {
        this.n = years.length;
        this.svensson = svensson;
        this.exponentials = Exponentials.of(years);
        int points = svensson ? SVENSSON_POINTS : NELSON_SIEGEL_POINTS;
        this.logTau = new double[points];
        double[][] slope = new double[points][n];
        this.hump = new double[points][n];
        for (int k = 0; k < points; k++) {
            logTau[k] = minLogTau + (maxLogTau - minLogTau) * k / (points - 1);
            double tau = Math.exp(logTau[k]);
            for (int i = 0; i < n; i++) {
                double x = years[i] / tau;
                double e = Math.exp(-x);
                slope[k][i] = NssProfile.loading(x, e);
                hump[k][i] = slope[k][i] - e;
            }
        }
        double[] humpSquared = new double[points];
        for (int k = 0; k < points; k++) {
            humpSquared[k] = NssProfile.dot(hump[k], hump[k]);
        }
        this.q = new double[points][3][n];
        this.active = new boolean[points][3];
        this.rest = new double[points][svensson ? points : 0];
        for (int a = 0; a < points; a++) {
            double[][] qa = q[a];
            Arrays.fill(qa[0], 1.0);
            System.arraycopy(slope[a], 0, qa[1], 0, n);
            System.arraycopy(hump[a], 0, qa[2], 0, n);
            for (int k = 0; k < 3; k++) {
                active[a][k] = orthonormalise(qa[k], qa, active[a], k);
            }
            for (int b = 0; b < rest[a].length; b++) {
                rest[a][b] = orthogonalSquared(hump[b], humpSquared[b], qa, active[a]);
            }
        }
    }

    int maturities() {
        return n;
    }

    boolean svensson() {
        return svensson;
    }

    /** How the fit gets the exponentials of these maturities, kept here with the rest of the tenor set's work. */
    Exponentials exponentials() {
        return exponentials;
    }

    /**
     * Up to {@code maxStarts} grid points that are local minima of the sum of squares of
     * {@code yields} (no lower neighbour), best first, as log decay parameters.
     */
    List<double[]> starts(double[] yields, int maxStarts) {
        int points = logTau.length;
        double[][] cost = new double[points][svensson ? points : 1];
        double[] residual = new double[n];
        for (int a = 0; a < points; a++) {
            double[][] qa = q[a];
            System.arraycopy(yields, 0, residual, 0, n);
            for (int k = 0; k < 3; k++) {
                NssProfile.axpy(-NssProfile.dot(qa[k], yields), qa[k], residual);
            }
            double base = NssProfile.dot(residual, residual);
            if (!svensson) {
                cost[a][0] = base;
                continue;
            }
            for (int b = 0; b < points; b++) {
                cost[a][b] = base - reduction(hump[b], rest[a][b], residual);
            }
        }
        return localMinima(cost, logTau, svensson, maxStarts);
    }

    /**
     * Orthogonalises {@code column} against the first {@code count} active columns of {@code q}
     * (two Gram–Schmidt passes, as in {@link NssProfile}) and normalises it; false when nothing
     * independent of them is left, in which case the column is zeroed.
     */
    private static boolean orthonormalise(double[] column, double[][] q, boolean[] active, int count) {
        double length = NssProfile.norm(column);
        for (int pass = 0; pass < 2; pass++) {
            for (int j = 0; j < count; j++) {
                if (active[j]) {
                    NssProfile.axpy(-NssProfile.dot(q[j], column), q[j], column);
                }
            }
        }
        double rest = NssProfile.norm(column);
        boolean independent = rest > NssProfile.DEPENDENT * length;
        for (int i = 0; i < column.length; i++) {
            column[i] = independent ? column[i] / rest : 0.0;
        }
        return independent;
    }

    /**
     * |h⊥|² = hᵀh − Σ(qⱼᵀh)² for column h against the orthonormal q; NaN when h is nearly in the
     * span of q (τ2 near τ1), where the subtraction has lost its precision: such a column counts
     * as adding nothing, which only makes the coarse grid slightly pessimistic there.
     */
    private static double orthogonalSquared(double[] h, double hh, double[][] q, boolean[] active) {
        double rest = hh;
        for (int j = 0; j < q.length; j++) {
            if (active[j]) {
                double c = NssProfile.dot(q[j], h);
                rest -= c * c;
            }
        }
        return rest > NEARLY_DEPENDENT * hh ? rest : Double.NaN;
    }

    /**
     * How much adding column h to the fit of the first three (residual r ⟂ q) lowers the sum of
     * squares: (hᵀr)² / |h⊥|², one dot product instead of orthogonalising h.
     */
    private static double reduction(double[] h, double orthogonalSquared, double[] residual) {
        if (Double.isNaN(orthogonalSquared)) {
            return 0.0;
        }
        double hr = NssProfile.dot(h, residual);
        return Math.min(hr * hr / orthogonalSquared, Double.MAX_VALUE);
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
        // the cell itself is among those compared: it is never lower than itself
        int lastRow = Math.min(a + 1, cost.length - 1);
        int firstColumn = Math.max(b - 1, 0);
        int lastColumn = Math.min(b + 1, cost[0].length - 1);
        for (int na = Math.max(a - 1, 0); na <= lastRow; na++) {
            double[] row = cost[na];
            for (int nb = firstColumn; nb <= lastColumn; nb++) {
                if (row[nb] < here) {
                    return false;
                }
            }
        }
        return true;
    }
}
