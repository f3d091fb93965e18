package org.slopewatch.web;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.journal.JournalReader;

/**
 * Merges what the journal holds about one spread into one chronological list: by the time each
 * row was recorded; within one recording (one pipeline step is one transaction, so its rows share
 * the time) inputs before conclusions (observations, then transitions, then notices, then what
 * became of them); then by the journal's own order of each kind. The order is total, so the same
 * journal always gives the same list.
 */
final class SpreadTimeline {

    private record Entry(TimelineItem item, int rank, long order, String tie) {
    }

    private static final Comparator<Entry> ORDER = Comparator.<Entry, Instant>comparing(e -> e.item().recordedAt())
            .thenComparingInt(Entry::rank).thenComparingLong(Entry::order).thenComparing(Entry::tie);

    private SpreadTimeline() {
    }

    static List<TimelineItem> merge(List<JournalReader.StoredObservation> observations, List<JournalReader.StoredTransition> transitions,
                                    List<AlertHistory.AlertView> alerts, List<DeliveryAttempts.StoredAttempt> attempts) {
        List<Entry> entries = new ArrayList<>();
        observations.forEach(o -> entries.add(new Entry(TimelineItem.ObservationItem.of(o), 0, o.id(), "")));
        transitions.forEach(t -> entries.add(new Entry(TimelineItem.TransitionItem.of(t), 1, t.id(), "")));
        for (AlertHistory.AlertView a : alerts) {
            entries.add(new Entry(TimelineItem.AlertItem.of(a), 2, a.stored().alert().createdAt().toEpochMilli(), a.stored().alert().id()));
            a.acks().forEach(k -> entries.add(new Entry(TimelineItem.AckItem.of(k), 4, 0, k.alertId() + "|" + k.by())));
        }
        attempts.forEach(k -> entries.add(new Entry(TimelineItem.AttemptItem.of(k), 3, k.id(), "")));
        entries.sort(ORDER);
        return entries.stream().map(Entry::item).toList();
    }
}
