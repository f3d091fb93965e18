package org.slopewatch.monitor;

import java.time.LocalDate;
import org.slopewatch.text.Excerpt;

/** A calendar quarter, written {@code 1966Q1}. */
public record Quarter(int year, int quarter) implements Comparable<Quarter> {

    public Quarter {
        if (quarter < 1 || quarter > 4) {
            throw new IllegalArgumentException("quarter must be 1-4, got " + quarter);
        }
    }

    /** Parses {@code 1966Q1}. */
    public static Quarter parse(String text) {
        int q = text.indexOf('Q');
        try {
            if (q > 0 && q == text.length() - 2) {
                return new Quarter(Integer.parseInt(text.substring(0, q)), text.charAt(q + 1) - '0');
            }
        } catch (IllegalArgumentException e) {
            // reported below
        }
        throw new IllegalArgumentException("unparsable quarter " + Excerpt.quoted(text) + " (expected e.g. 1966Q1)");
    }

    public static Quarter of(LocalDate date) {
        return new Quarter(date.getYear(), (date.getMonthValue() - 1) / 3 + 1);
    }

    /** A dense index (year·4 + quarter − 1) that orders quarters and is cheap to compare. */
    public int index() {
        return year * 4 + quarter - 1;
    }

    public static Quarter ofIndex(int index) {
        return new Quarter(Math.floorDiv(index, 4), Math.floorMod(index, 4) + 1);
    }

    public LocalDate firstDay() {
        return LocalDate.of(year, (quarter - 1) * 3 + 1, 1);
    }

    @Override
    public int compareTo(Quarter other) {
        return Integer.compare(index(), other.index());
    }

    @Override
    public String toString() {
        return year + "Q" + quarter;
    }
}
