package org.slopewatch.replay;

import java.time.LocalDate;
import java.util.List;

/** The whole result of a replay: what was read and, per spread, what the monitor found. */
public record ReplayReport(String source, long rows, long quotes, long snapshots, LocalDate firstDate, LocalDate lastDate,
                           Integer falseAlarmWindowMonths, List<SpreadReport> spreads, String caution) {

    /** Shown under every report, as under every alert. */
    public static final String CAUTION = "A statistical signal, not investment advice: decisions rest with the desk's own "
            + "risk policy and licensed professionals. Inversions have given false alarms, and central-bank "
            + "balance-sheet policy can distort term spreads.";

    public ReplayReport {
        spreads = List.copyOf(spreads);
    }
}
