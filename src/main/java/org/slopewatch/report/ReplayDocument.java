package org.slopewatch.report;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.replay.SpreadReport;
import org.slopewatch.replay.SpreadValues;

/** A report document from a replay: its report, the values behind it, the policy and the recession dates. */
public final class ReplayDocument {

    private ReplayDocument() {
    }

    /**
     * @param values      {@link org.slopewatch.replay.Replay#values()} of the same replay
     * @param recessions    the dates the lead times were measured against, or null
     * @param probabilities by spread id, the probability at the end of the data; spreads without a model are absent
     * @param generatedAt   when the report was made (the caller's clock)
     */
    public static ReportDocument of(ReplayReport report, List<SpreadValues> values, PolicySummary policy, RecessionDates recessions,
                                    Map<String, SpreadProbability> probabilities, Instant generatedAt) {
        Map<String, SpreadValues> byId = values.stream().collect(Collectors.toMap(SpreadValues::spreadId, Function.identity()));
        List<SpreadSection> sections = new ArrayList<>();
        for (SpreadReport s : report.spreads()) {
            SpreadValues v = byId.get(s.id());
            if (v == null) {
                throw new IllegalArgumentException("no values for " + s.id() + ": values must come from the same replay");
            }
            sections.add(new SpreadSection(s.id(), s.curve(), s.spread(), s.rules(), s.finalState(), s.lastDate(), s.lastValueBp(),
                    s.observations(), ChartPoints.thin(v.size(), v::date, v::valueBp, ChartPoints.MAX_POINTS),
                    s.spells().stream().map(SpellBand::of).toList(), s.transitions(), s.leads(), s.peaks(), s.missedPeaks(),
                    s.unassessedPeaks(), probabilities.get(s.id())));
        }
        List<ReportSource.Detail> details = new ArrayList<>();
        details.add(new ReportSource.Detail("Read", String.format(Locale.ROOT, "%,d rows, %,d quotes, %,d curve snapshots",
                report.rows(), report.quotes(), report.snapshots())));
        if (recessions != null) {
            details.add(new ReportSource.Detail("Recession dates", recessions.source()));
        }
        ReportSource source = new ReportSource("history file", report.source(),
                report.spreads().stream().map(SpreadReport::curve).distinct().toList(),
                report.spreads().stream().map(SpreadReport::id).toList(), report.firstDate(), report.lastDate(), generatedAt, details);
        Path file = Path.of(report.source()).getFileName();
        String title = "Inversion report: replay of " + (file == null ? report.source() : file.toString());
        return new ReportDocument(title, source, policy, recessions, report.falseAlarmWindowMonths(), sections, report.caution());
    }
}
