package org.slopewatch.report;

import java.time.LocalDate;
import java.util.Comparator;
import java.util.List;
import org.slopewatch.probability.Recession;

/**
 * The business-cycle dates a report is measured against, with the file they came from.
 * Following {@link Recession}, a recession occupies the months after its peak through its trough.
 */
public record RecessionDates(String source, List<Recession> recessions) {

    public RecessionDates {
        recessions = List.copyOf(recessions);
    }

    /** The recessions with at least one month between {@code first} and {@code last}, in date order. */
    public List<Recession> within(LocalDate first, LocalDate last) {
        return recessions.stream()
                .filter(r -> !start(r).isAfter(last) && !end(r).isBefore(first))
                .sorted(Comparator.comparing(Recession::peak))
                .toList();
    }

    /** The first day of the first recession month: the month after the peak. */
    public static LocalDate start(Recession r) {
        return r.peak().plusMonths(1).atDay(1);
    }

    /** The last day of the trough month. */
    public static LocalDate end(Recession r) {
        return r.trough().atEndOfMonth();
    }
}
