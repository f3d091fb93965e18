package org.slopewatch.report;

import java.util.List;
import java.util.Objects;

/**
 * Everything one HTML report shows, gathered before any of it is drawn, so the replay and the
 * journal produce the same page.
 *
 * @param recessions             business-cycle dates given for the report, or null when none were
 * @param falseAlarmWindowMonths the lead-time window, or null without recession dates
 */
public record ReportDocument(String title, ReportSource source, PolicySummary policy, RecessionDates recessions,
                             Integer falseAlarmWindowMonths, List<SpreadSection> spreads, String caution) {

    public ReportDocument {
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(policy, "policy");
        Objects.requireNonNull(caution, "caution: every report carries it");
        spreads = List.copyOf(spreads);
    }
}
