package org.slopewatch.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.function.IntFunction;
import java.util.function.IntToDoubleFunction;

/**
 * The values a chart plots. A chart is about a thousand pixels wide, and a long daily history has
 * hundreds of thousands of dates: past {@link #MAX_POINTS} the series is cut into buckets and
 * each keeps its lowest and highest value, so every trough (the depth of an inversion) and every
 * peak still shows, in a file that stays small enough to mail.
 */
public final class ChartPoints {

    public static final int MAX_POINTS = 4_000;

    private ChartPoints() {
    }

    /** All values when there are at most {@code max}; otherwise each bucket's low and high, in date order. */
    public static List<ChartPoint> thin(int size, IntFunction<LocalDate> date, IntToDoubleFunction valueBp, int max) {
        if (max < 2) {
            throw new IllegalArgumentException("a chart needs at least 2 points, asked for " + max);
        }
        List<ChartPoint> out = new ArrayList<>(Math.min(size, max));
        if (size <= max) {
            for (int i = 0; i < size; i++) {
                out.add(new ChartPoint(date.apply(i), valueBp.applyAsDouble(i)));
            }
            return out;
        }
        int buckets = max / 2;
        for (int b = 0; b < buckets; b++) {
            int from = (int) ((long) size * b / buckets);
            int to = (int) ((long) size * (b + 1) / buckets);
            int low = from;
            int high = from;
            for (int i = from + 1; i < to; i++) {
                double v = valueBp.applyAsDouble(i);
                if (v < valueBp.applyAsDouble(low)) {
                    low = i;
                }
                if (v > valueBp.applyAsDouble(high)) {
                    high = i;
                }
            }
            int first = Math.min(low, high);
            int second = Math.max(low, high);
            out.add(new ChartPoint(date.apply(first), valueBp.applyAsDouble(first)));
            if (second != first) {
                out.add(new ChartPoint(date.apply(second), valueBp.applyAsDouble(second)));
            }
        }
        return out;
    }
}
