package org.slopewatch.history;

import java.time.DateTimeException;
import java.time.LocalDate;

/**
 * The dates of history files, read without the cost of the general parser, which dominates a
 * large replay otherwise: ISO {@code YYYY-MM-DD} and {@code YYYY-MM} (the first of the month), and
 * the Treasury's {@code MM/DD/YYYY}.
 */
final class Dates {
    private Dates() {
    }

    static LocalDate parse(String text) {
        String t = text.strip();
        int len = t.length();
        if ((len != 10 && len != 7) || t.charAt(4) != '-' || (len == 10 && t.charAt(7) != '-')) {
            return null;
        }
        int year = digits(t, 0, 4);
        int month = digits(t, 5, 7);
        int day = len == 10 ? digits(t, 8, 10) : 1;
        if (year < 0 || month < 0 || day < 0) {
            return null;
        }
        try {
            return LocalDate.of(year, month, day);
        } catch (DateTimeException e) {
            return null;
        }
    }

    /** {@code MM/DD/YYYY}, the month and day of one or two digits. */
    static LocalDate parseUs(String text) {
        String[] parts = text.strip().split("/", -1);
        if (parts.length != 3 || parts[0].isEmpty() || parts[0].length() > 2 || parts[1].isEmpty() || parts[1].length() > 2
                || parts[2].length() != 4) {
            return null;
        }
        int month = digits(parts[0], 0, parts[0].length());
        int day = digits(parts[1], 0, parts[1].length());
        int year = digits(parts[2], 0, 4);
        if (year < 0 || month < 0 || day < 0) {
            return null;
        }
        try {
            return LocalDate.of(year, month, day);
        } catch (DateTimeException e) {
            return null;
        }
    }

    private static int digits(String t, int from, int to) {
        int v = 0;
        for (int i = from; i < to; i++) {
            char c = t.charAt(i);
            if (c < '0' || c > '9') {
                return -1;
            }
            v = v * 10 + (c - '0');
        }
        return v;
    }
}
