package org.slopewatch.curve;

import java.time.LocalDate;
import java.util.Arrays;
import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * The yields of one curve on one market date, in basis points, bond-equivalent basis, each taken
 * to {@link Resolution#BASIS_POINTS} as it comes in: a quote of 8.05 % is 805 bp, not the
 * 805.0000000000001 that 8.05 × 100 computes.
 *
 * <p>Immutable. Tenors are kept sorted by maturity in two parallel arrays because spreads are
 * computed for every snapshot on the hot path of a replay, where a map per row would dominate.
 */
public final class CurveSnapshot {

    private final String curve;
    private final LocalDate date;
    private final Tenor[] tenors;
    private final double[] yieldsBp;

    private CurveSnapshot(String curve, LocalDate date, Tenor[] tenors, double[] yieldsBp) {
        this.curve = Objects.requireNonNull(curve, "curve");
        this.date = Objects.requireNonNull(date, "date");
        this.tenors = tenors;
        this.yieldsBp = yieldsBp;
    }

    public static CurveSnapshot empty(String curve, LocalDate date) {
        return new CurveSnapshot(curve, date, new Tenor[0], new double[0]);
    }

    /** A snapshot from a map of tenor to yield in basis points; NaN entries are left out. */
    public static CurveSnapshot of(String curve, LocalDate date, Map<Tenor, Double> yieldsBp) {
        SortedMap<Tenor, Double> sorted = new TreeMap<>(yieldsBp);
        sorted.values().removeIf(v -> v == null || Double.isNaN(v));
        Tenor[] tenors = sorted.keySet().toArray(new Tenor[0]);
        double[] values = sorted.values().stream().mapToDouble(Resolution.BASIS_POINTS::round).toArray();
        return new CurveSnapshot(curve, date, tenors, values);
    }

    /**
     * A snapshot from columns already sorted by maturity (as a wide CSV header is, once sorted);
     * NaN marks a missing value and is left out. The arrays are copied.
     */
    public static CurveSnapshot ofSorted(String curve, LocalDate date, Tenor[] sortedTenors, double[] yieldsBp) {
        int n = 0;
        for (double v : yieldsBp) {
            if (!Double.isNaN(v)) {
                n++;
            }
        }
        Tenor[] t = new Tenor[n];
        double[] y = new double[n];
        for (int i = 0, j = 0; i < yieldsBp.length; i++) {
            if (!Double.isNaN(yieldsBp[i])) {
                if (j > 0 && sortedTenors[i].compareTo(t[j - 1]) <= 0) {
                    throw new IllegalArgumentException("tenors not in increasing maturity order: " + t[j - 1] + ", " + sortedTenors[i]);
                }
                t[j] = sortedTenors[i];
                y[j++] = Resolution.BASIS_POINTS.round(yieldsBp[i]);
            }
        }
        return new CurveSnapshot(curve, date, t, y);
    }

    /** A copy with one tenor set (added or replaced). */
    public CurveSnapshot with(Tenor tenor, double quotedBp) {
        double yieldBp = Resolution.BASIS_POINTS.round(quotedBp);
        int at = indexOf(tenor);
        if (at >= 0) {
            double[] y = yieldsBp.clone();
            y[at] = yieldBp;
            return new CurveSnapshot(curve, date, tenors, y);
        }
        int insert = -at - 1;
        Tenor[] t = new Tenor[tenors.length + 1];
        double[] y = new double[tenors.length + 1];
        System.arraycopy(tenors, 0, t, 0, insert);
        System.arraycopy(yieldsBp, 0, y, 0, insert);
        t[insert] = tenor;
        y[insert] = yieldBp;
        System.arraycopy(tenors, insert, t, insert + 1, tenors.length - insert);
        System.arraycopy(yieldsBp, insert, y, insert + 1, tenors.length - insert);
        return new CurveSnapshot(curve, date, t, y);
    }

    public String curve() {
        return curve;
    }

    public LocalDate date() {
        return date;
    }

    public int size() {
        return tenors.length;
    }

    public Tenor tenor(int index) {
        return tenors[index];
    }

    public double yieldBp(int index) {
        return yieldsBp[index];
    }

    /** The quoted yield at a tenor in basis points, or NaN when the tenor was not quoted. */
    public double yieldBp(Tenor tenor) {
        int at = indexOf(tenor);
        return at >= 0 ? yieldsBp[at] : Double.NaN;
    }

    /**
     * The yield at a tenor: quoted if present, otherwise linear in maturity between the nearest
     * quoted neighbours on each side. NaN when the tenor lies outside the quoted range, since
     * extrapolating a leg would invent a spread.
     */
    public double interpolatedBp(Tenor tenor) {
        int at = indexOf(tenor);
        if (at >= 0) {
            return yieldsBp[at];
        }
        int upper = -at - 1;
        if (upper == 0 || upper == tenors.length) {
            return Double.NaN;
        }
        double x0 = tenors[upper - 1].years();
        double x1 = tenors[upper].years();
        double w = (tenor.years() - x0) / (x1 - x0);
        return yieldsBp[upper - 1] + w * (yieldsBp[upper] - yieldsBp[upper - 1]);
    }

    /** The quoted points as an ordered map (a copy), for display and serialisation. */
    public SortedMap<Tenor, Double> asMap() {
        SortedMap<Tenor, Double> map = new TreeMap<>();
        for (int i = 0; i < tenors.length; i++) {
            map.put(tenors[i], yieldsBp[i]);
        }
        return Collections.unmodifiableSortedMap(map);
    }

    private int indexOf(Tenor tenor) {
        // tenors are few (at most a dozen or so): a linear scan beats a binary search here
        for (int i = 0; i < tenors.length; i++) {
            int c = tenors[i].compareTo(tenor);
            if (c == 0) {
                return i;
            }
            if (c > 0) {
                return -i - 1;
            }
        }
        return -tenors.length - 1;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof CurveSnapshot s && curve.equals(s.curve) && date.equals(s.date)
                && Arrays.equals(tenors, s.tenors) && Arrays.equals(yieldsBp, s.yieldsBp);
    }

    @Override
    public int hashCode() {
        return Objects.hash(curve, date, Arrays.hashCode(tenors), Arrays.hashCode(yieldsBp));
    }

    @Override
    public String toString() {
        return curve + " " + date + " " + asMap();
    }
}
