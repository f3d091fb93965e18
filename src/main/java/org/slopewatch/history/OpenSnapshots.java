package org.slopewatch.history;

import java.time.LocalDate;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.function.Consumer;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;

/**
 * The snapshots of a long file still taking rows, at most one per curve, and the rule of when each
 * is complete: a curve's snapshot of a date is handed on when a row of that curve for a later date
 * comes, or when the file ends (then in the order their first quotes came).
 *
 * <p>So the rows may come in any order that keeps each curve's dates ascending, the only order the
 * monitors see, since each curve's spreads are watched apart from every other curve's: sorted by
 * date, by curve and then date as a database dump writes them, or curves interleaved, the tenors
 * of a curve's date in any order and not necessarily together. Only one snapshot per curve is held,
 * however long the file, so a large file is read in the memory of a few curves. A row going back on
 * its curve's dates is refused: the snapshot it belongs to is already handed on, and a report built
 * without it would be passed off as whole.
 */
final class OpenSnapshots {

    /** A row that cannot be placed: its curve's snapshot of that date is already handed on. */
    static final class OutOfOrder extends Exception {
        OutOfOrder(String problem) {
            super(problem, null, false, false);
        }
    }

    /** One curve's place in the file. */
    static final class Curve {
        private final String name;
        private final CurveQuotes quotes = new CurveQuotes();
        /** The date taking rows: from the curve's first row on, its latest date. */
        private LocalDate open;

        private Curve(String name) {
            this.name = name;
        }
    }

    private final Consumer<CurveSnapshot> sink;
    private final Map<String, Curve> curves = new HashMap<>();
    /** Curves holding quotes, in the order their first quote of the open date came. */
    private final LinkedHashSet<Curve> holding = new LinkedHashSet<>();
    /** The curve of the row before: rows of one curve usually come together. */
    private Curve last;

    OpenSnapshots(Consumer<CurveSnapshot> sink) {
        this.sink = sink;
    }

    /**
     * The curve of a row dated {@code date}, its snapshot of that date open for the row's quote.
     *
     * @throws OutOfOrder when the curve has a later date already: its snapshot of this date is handed on
     */
    Curve row(String curve, LocalDate date) throws OutOfOrder {
        Curve c = last != null && last.name.equals(curve) ? last : curves.computeIfAbsent(curve, Curve::new);
        last = c;
        if (c.open != null) {
            if (date.equals(c.open)) {
                return c;
            }
            if (date.isBefore(c.open)) {
                throw new OutOfOrder("dates out of order: " + date + " after " + c.open);
            }
            if (c.quotes.size > 0) {
                holding.remove(c);
                hand(c);
            } // else a date of missing values only: passed, with nothing to hand on
        }
        c.open = date;
        return c;
    }

    /** Adds a quote to the curve's open snapshot; false if its tenor is already quoted there. */
    boolean put(Curve c, Tenor tenor, double bp) {
        if (!c.quotes.put(tenor, bp)) {
            return false;
        }
        if (c.quotes.size == 1) {
            holding.add(c);
        }
        return true;
    }

    /** Hands on every snapshot still open, in the order their first quotes came; after the last row. */
    void finish() {
        for (Curve c : holding) {
            hand(c);
        }
        holding.clear();
    }

    private void hand(Curve c) {
        CurveSnapshot snapshot = c.quotes.snapshot(c.name, c.open);
        c.quotes.size = 0;
        sink.accept(snapshot);
    }

    /**
     * One curve's quotes on its open date, kept in maturity order as they arrive: a pair of arrays
     * rather than a map of boxed values, reused from date to date.
     */
    private static final class CurveQuotes {
        private Tenor[] tenors = new Tenor[16];
        private double[] yieldsBp = new double[16];
        private int size;

        /** Adds a quote in its place by maturity; false if the tenor is already quoted. */
        boolean put(Tenor tenor, double bp) {
            int at = size;
            while (at > 0 && tenors[at - 1].compareTo(tenor) > 0) {
                at--;
            }
            if (at > 0 && tenors[at - 1].compareTo(tenor) == 0) {
                return false;
            }
            if (size == tenors.length) {
                tenors = Arrays.copyOf(tenors, size * 2);
                yieldsBp = Arrays.copyOf(yieldsBp, size * 2);
            }
            System.arraycopy(tenors, at, tenors, at + 1, size - at);
            System.arraycopy(yieldsBp, at, yieldsBp, at + 1, size - at);
            tenors[at] = tenor;
            yieldsBp[at] = bp;
            size++;
            return true;
        }

        CurveSnapshot snapshot(String curve, LocalDate date) {
            return CurveSnapshot.ofSorted(curve, date, Arrays.copyOf(tenors, size), Arrays.copyOf(yieldsBp, size));
        }
    }
}
