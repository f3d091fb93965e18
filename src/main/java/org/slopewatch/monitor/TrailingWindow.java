package org.slopewatch.monitor;

import java.util.Arrays;
import org.slopewatch.curve.Resolution;

/**
 * The observations of a trailing window of calendar days, as a ring buffer with a running sum
 * and a running count of inverted observations, so that a step costs O(1) amortised.
 *
 * <p>Values are kept in steps of {@link Resolution#BASIS_POINTS}, so the running sum is exact: no
 * rounding piles up however long the window runs, and an average on a threshold is on it.
 */
final class TrailingWindow {

    private final int windowDays;
    private int[] days = new int[16];
    private long[] values = new long[16];
    private boolean[] inverted = new boolean[16];
    private int head;
    private int size;
    private long sum;
    private int invertedCount;

    TrailingWindow(int windowDays) {
        this.windowDays = windowDays;
    }

    /** Adds an observation and drops those that fell out of the window ending on {@code day}. */
    void add(int day, long value, boolean isInverted) {
        int oldest = day - windowDays; // days at or before this are outside (day − windowDays, day]
        while (size > 0 && days[head] <= oldest) {
            sum -= values[head];
            if (inverted[head]) {
                invertedCount--;
            }
            head = (head + 1) % days.length;
            size--;
        }
        if (size == days.length) {
            grow();
        }
        int tail = (head + size) % days.length;
        days[tail] = day;
        values[tail] = value;
        inverted[tail] = isInverted;
        size++;
        sum += value;
        if (isInverted) {
            invertedCount++;
        }
    }

    int windowDays() {
        return windowDays;
    }

    int size() {
        return size;
    }

    /** The average, to the resolution. */
    double average() {
        return Resolution.BASIS_POINTS.average(sum, size);
    }

    /** Whether the average, to the resolution, is below {@code boundBp}. */
    boolean averageBelow(double boundBp) {
        return Resolution.BASIS_POINTS.averageBelow(sum, size, boundBp);
    }

    /** The share of inverted observations, to {@link Resolution#PROBABILITY}, as evidence and reasons give it. */
    double invertedShare() {
        return Resolution.PROBABILITY.round((double) invertedCount / size);
    }

    /** Whether at least {@code share} of the observations are inverted, compared in whole numbers. */
    boolean invertedShareAtLeast(double share) {
        return Resolution.PROBABILITY.shareAtLeast(invertedCount, size, share);
    }

    private void grow() {
        int n = days.length * 2;
        int[] d = new int[n];
        long[] v = new long[n];
        boolean[] b = new boolean[n];
        for (int i = 0; i < size; i++) {
            int from = (head + i) % days.length;
            d[i] = days[from];
            v[i] = values[from];
            b[i] = inverted[from];
        }
        days = d;
        values = v;
        inverted = b;
        head = 0;
    }

    void copyFrom(TrailingWindow other) {
        if (days.length != other.days.length) {
            days = new int[other.days.length];
            values = new long[other.days.length];
            inverted = new boolean[other.days.length];
        }
        System.arraycopy(other.days, 0, days, 0, days.length);
        System.arraycopy(other.values, 0, values, 0, values.length);
        System.arraycopy(other.inverted, 0, inverted, 0, inverted.length);
        head = other.head;
        size = other.size;
        sum = other.sum;
        invertedCount = other.invertedCount;
    }

    /** Writes the window's observations, oldest first (checkpoints). */
    void writeTo(java.io.DataOutput out) throws java.io.IOException {
        out.writeInt(windowDays);
        out.writeInt(size);
        for (int i = 0; i < size; i++) {
            int at = (head + i) % days.length;
            out.writeInt(days[at]);
            out.writeLong(values[at]);
            out.writeBoolean(inverted[at]);
        }
    }

    /** Reads what {@link #writeTo} wrote into this (empty or not) window of the same length. */
    void readFrom(java.io.DataInput in) throws java.io.IOException {
        int w = in.readInt();
        if (w != windowDays) {
            throw new java.io.IOException("a " + w + "-day window read into a " + windowDays + "-day one");
        }
        int n = TrackCodec.count(in);
        int capacity = Math.max(16, Integer.highestOneBit(Math.max(1, n)) * 2);
        days = new int[capacity];
        values = new long[capacity];
        inverted = new boolean[capacity];
        head = 0;
        size = n;
        sum = 0;
        invertedCount = 0;
        for (int i = 0; i < n; i++) {
            days[i] = in.readInt();
            values[i] = in.readLong();
            inverted[i] = in.readBoolean();
            sum += values[i];
            if (inverted[i]) {
                invertedCount++;
            }
        }
    }

    @Override
    public String toString() {
        return "TrailingWindow[" + windowDays + "d, size=" + size + ", days=" + Arrays.toString(Arrays.copyOf(days, Math.min(size, 4))) + "…]";
    }
}
