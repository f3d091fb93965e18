package org.slopewatch.report;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.replay.SpreadReport;
import org.slopewatch.spread.SpreadKey;

/**
 * A report document from what the daemon journalled: each spread's standing values and its
 * transitions (those a revision replaced left out). The spells are read off the transitions.
 */
public final class JournalDocument {

    private JournalDocument() {
    }

    /**
     * One spread as the journal has it.
     *
     * @param rules       the rules of the policy in force for it, in one line
     * @param values      the standing value on each date, in date order
     * @param transitions in market-date order
     * @param probability the recession probability now, or null when no model covers the spread
     */
    public record SpreadInput(SpreadKey key, String rules, List<ChartPoint> values, List<SpreadReport.TransitionRow> transitions,
                              SpreadProbability probability) {

        public SpreadInput {
            Objects.requireNonNull(key, "key");
            values = List.copyOf(values);
            transitions = List.copyOf(transitions);
        }
    }

    /** @param journal a description of the journal for the reader (never its URL: it may carry credentials) */
    public static ReportDocument of(List<SpreadInput> spreads, PolicySummary policy, String journal, Instant generatedAt) {
        List<SpreadSection> sections = new ArrayList<>();
        LocalDate first = null;
        LocalDate last = null;
        for (SpreadInput in : spreads) {
            List<ChartPoint> v = in.values();
            ChartPoint end = v.isEmpty() ? null : v.get(v.size() - 1);
            String state = in.transitions().isEmpty() ? SpreadState.NORMAL.name() : in.transitions().get(in.transitions().size() - 1).to();
            sections.add(new SpreadSection(in.key().id(), in.key().curve(), in.key().spread(), in.rules(), state,
                    end == null ? null : end.date(), end == null ? null : end.valueBp(), v.size(),
                    ChartPoints.thin(v.size(), i -> v.get(i).date(), i -> v.get(i).valueBp(), ChartPoints.MAX_POINTS),
                    SpellBand.fromTransitions(in.transitions()), in.transitions(), null, null, null, null, in.probability()));
            if (!v.isEmpty()) {
                first = first == null || v.get(0).date().isBefore(first) ? v.get(0).date() : first;
                last = last == null || end.date().isAfter(last) ? end.date() : last;
            }
        }
        ReportSource source = new ReportSource("journal", journal,
                spreads.stream().map(s -> s.key().curve()).distinct().toList(),
                spreads.stream().map(s -> s.key().id()).toList(), first, last, generatedAt, List.of());
        String title = "Inversion report: " + String.join(", ", source.spreads()) + " from the journal";
        return new ReportDocument(title, source, policy, null, null, sections, ReplayReport.CAUTION);
    }
}
