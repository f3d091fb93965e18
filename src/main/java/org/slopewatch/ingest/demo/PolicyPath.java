package org.slopewatch.ingest.demo;

import java.time.LocalDate;
import java.util.List;

/**
 * A scripted policy stance: the gap between the policy rate and its long-run level, in basis
 * points, as a piecewise-linear function of the date. Knots are placed a whole number of months
 * after the scenario's start; before the first knot and after the last the gap stays flat, which
 * is what lets a scenario run on indefinitely once its script is over.
 *
 * @param knots at least one, in strictly increasing month order
 */
public record PolicyPath(List<Knot> knots) {

    /** The gap reached a number of months after the start. */
    public record Knot(int monthsAfterStart, double gapBp) {

        public Knot {
            if (monthsAfterStart < 0) {
                throw new IllegalArgumentException("knot before the start: " + monthsAfterStart + " months");
            }
            if (!Double.isFinite(gapBp)) {
                throw new IllegalArgumentException("knot gap must be finite, got " + gapBp);
            }
        }
    }

    public PolicyPath {
        knots = List.copyOf(knots);
        if (knots.isEmpty()) {
            throw new IllegalArgumentException("a policy path needs at least one knot");
        }
        for (int i = 1; i < knots.size(); i++) {
            if (knots.get(i).monthsAfterStart() <= knots.get(i - 1).monthsAfterStart()) {
                throw new IllegalArgumentException("policy knots must be in increasing month order: month "
                        + knots.get(i - 1).monthsAfterStart() + " then month " + knots.get(i).monthsAfterStart());
            }
        }
    }

    public static PolicyPath of(Knot... knots) {
        return new PolicyPath(List.of(knots));
    }

    /** The month of the last knot, after which the gap no longer changes. */
    public int scriptMonths() {
        return knots.get(knots.size() - 1).monthsAfterStart();
    }

    /** The gap in basis points on a date, for a scenario that started on {@code start}. */
    public double gapBp(LocalDate start, LocalDate date) {
        long day = date.toEpochDay();
        Knot first = knots.get(0);
        if (day <= dayOf(start, first)) {
            return first.gapBp();
        }
        for (int i = 1; i < knots.size(); i++) {
            Knot to = knots.get(i);
            long toDay = dayOf(start, to);
            if (day <= toDay) {
                Knot from = knots.get(i - 1);
                long fromDay = dayOf(start, from);
                double w = (double) (day - fromDay) / (toDay - fromDay);
                return from.gapBp() + w * (to.gapBp() - from.gapBp());
            }
        }
        return knots.get(knots.size() - 1).gapBp();
    }

    private static long dayOf(LocalDate start, Knot knot) {
        return start.plusMonths(knot.monthsAfterStart()).toEpochDay();
    }
}
