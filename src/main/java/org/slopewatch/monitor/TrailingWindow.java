package org.slopewatch.monitor;

import java.util.Arrays;

/**
 * The observations of a trailing window of calendar days, as a ring buffer with a running sum
 * and a running count of inverted observations, so that a step costs O(1) amortised.
 */
final class TrailingWindow {

    private final int windowDays;
    private int[] days = new int[16];
    private double[] values = new double[16];
    private boolean[] inverted = new boolean[16];
    private int head;
    private int size;
    private double sum;
    private int invertedCount;

    TrailingWindow(int windowDays) {
        this.windowDays = windowDays;
    }

    /** Adds an observation and drops those that fell out of the window ending on {@code day}. */
    void add(int day, double value, boolean isInverted) {
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
        if (size == 1) {
            sum = value; // re-anchor the running sum whenever the window empties, so rounding never piles up
        }
    }

    int windowDays() {
        return windowDays;
    }

    int size() {
        return size;
    }

    double average() {
        return sum / size;
    }

    double invertedShare() {
        return (double) invertedCount / size;
    }

    private void grow() {
        int n = days.length * 2;
        int[] d = new int[n];
        double[] v = new double[n];
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
            values = new double[other.days.length];
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

    @Override
    public String toString() {
        return "TrailingWindow[" + windowDays + "d, size=" + size + ", days=" + Arrays.toString(Arrays.copyOf(days, Math.min(size, 4))) + "…]";
    }
}
