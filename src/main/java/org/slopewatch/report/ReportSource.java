package org.slopewatch.report;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

/**
 * What the report was made from: a history file replayed, or the daemon's journal.
 *
 * @param kind    "history file" or "journal", as the reader should see it
 * @param name    the file as given on the command line, or a description of the journal
 * @param details further facts in reading order (rows read, recession dates file, …)
 */
public record ReportSource(String kind, String name, List<String> curves, List<String> spreads, LocalDate firstDate,
                           LocalDate lastDate, Instant generatedAt, List<Detail> details) {

    /** One labelled fact. */
    public record Detail(String label, String value) {
    }

    public ReportSource {
        curves = List.copyOf(curves);
        spreads = List.copyOf(spreads);
        details = List.copyOf(details);
    }
}
