package org.slopewatch.replay;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.PeakLead;

/**
 * What a replay found for one spread. Field names become the JSON report's keys (snake case).
 *
 * @param leads       one entry per confirmation, or null when no recession dates were given
 * @param peaks       one entry per assessed peak (signalled ahead, late or missed), each counted once
 *                    however many confirmations it had; null when no recession dates were given
 * @param missedPeaks peaks missed, or null when no recession dates were given
 */
public record SpreadReport(String id, String curve, String spread, String rules, long observations, String finalState,
                           LocalDate lastDate, Double lastValueBp, List<QuarterRow> quarters,
                           List<TransitionRow> transitions, List<SpellRow> spells, List<RevisionRow> revisions,
                           List<LeadTime> leads, List<PeakLead> peaks, List<YearMonth> missedPeaks, List<YearMonth> unassessedPeaks) {

    /** A complete calendar quarter. */
    public record QuarterRow(String quarter, double averageBp, int observations) {
    }

    /** A state change with its evidence. */
    public record TransitionRow(LocalDate date, String from, String to, String test, String window, double measured,
                                double valueBp, long spell, String reason) {
    }

    /** An inversion spell; {@code end} is null for a spell still open at the end of the data. */
    public record SpellRow(long id, LocalDate start, LocalDate confirmed, String confirmedBy, LocalDate end,
                           long durationDays, int observations, double deepestBp, LocalDate deepestDate,
                           double invertedAreaBpDays) {
    }

    /** A changed outcome after a value was revised. */
    public record RevisionRow(LocalDate from, List<String> before, List<String> after) {
    }
}
