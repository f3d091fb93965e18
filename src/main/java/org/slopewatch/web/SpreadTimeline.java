package org.slopewatch.web;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.TimelineRows;

/**
 * Merges what the journal holds about one spread into one chronological list: by the time each
 * row was recorded; within one recording (one pipeline step is one transaction, so its rows share
 * the time) inputs before conclusions (observations, then transitions, then notices, then what
 * became of them); then in the journal's own order of each kind, as each list comes. That is the
 * order of {@link TimelineRows.Position}, so a page ends at a position the next page starts after.
 */
final class SpreadTimeline {

    /** A timeline item and its place. */
    record Entry(TimelineItem item, TimelineRows.Position position) {
    }

    // a stable sort: rows of one kind recorded together keep the order the journal gave them
    private static final Comparator<Entry> ORDER = Comparator.<Entry, java.time.Instant>comparing(e -> e.position().recordedAt())
            .thenComparing(e -> e.position().kind());

    private SpreadTimeline() {
    }

    static List<Entry> merge(List<TimelineRows.Row<JournalReader.StoredObservation>> observations,
                             List<TimelineRows.Row<JournalReader.StoredTransition>> transitions,
                             List<TimelineRows.Row<AlertHistory.AlertView>> alerts,
                             List<TimelineRows.Row<DeliveryAttempts.StoredAttempt>> attempts,
                             List<TimelineRows.Row<AlertHistory.Ack>> acks) {
        List<Entry> entries = new ArrayList<>();
        observations.forEach(r -> entries.add(new Entry(TimelineItem.ObservationItem.of(r.value()), r.position())));
        transitions.forEach(r -> entries.add(new Entry(TimelineItem.TransitionItem.of(r.value()), r.position())));
        alerts.forEach(r -> entries.add(new Entry(TimelineItem.AlertItem.of(r.value()), r.position())));
        attempts.forEach(r -> entries.add(new Entry(TimelineItem.AttemptItem.of(r.value()), r.position())));
        acks.forEach(r -> entries.add(new Entry(TimelineItem.AckItem.of(r.value()), r.position())));
        entries.sort(ORDER);
        return entries;
    }
}
