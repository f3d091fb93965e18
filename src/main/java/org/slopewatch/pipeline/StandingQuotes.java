package org.slopewatch.pipeline;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.function.LongConsumer;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.JournalReader;

/**
 * What a backfill need not send again: a quote whose curve and date the journal's latest quote
 * already gives with exactly the same yields. Taking it again would change nothing the journal
 * means (the curve book merges the same tenors over the same snapshot, and a spread's same value
 * again is no news), but would journal its rows a second time: a backfill run again after it was
 * stopped, or on a file that overlaps one loaded before, would double what it had loaded.
 * Everything else goes in: a date the journal lacks, and a date whose yields differ, which is a
 * revision, as it would be sent to the daemon.
 */
public final class StandingQuotes {

    private StandingQuotes() {
    }

    /** The messages, in their order, less those the journal holds already as they stand. */
    public static List<QuoteMessage> notYetJournalled(List<QuoteMessage> messages, JournalReader journal) {
        return notYetJournalled(messages, journal, done -> { });
    }

    /**
     * As {@link #notYetJournalled(List, JournalReader)}, telling {@code progress} the number of
     * messages checked so far after each curve (a large journal takes a while to read back).
     */
    public static List<QuoteMessage> notYetJournalled(List<QuoteMessage> messages, JournalReader journal, LongConsumer progress) {
        if (messages.isEmpty() || journal.quoteCount() == 0) {
            return messages; // a fresh journal: nothing to read back
        }
        Map<String, List<Integer>> byCurve = new LinkedHashMap<>();
        for (int i = 0; i < messages.size(); i++) {
            byCurve.computeIfAbsent(messages.get(i).curve(), c -> new ArrayList<>()).add(i);
        }
        boolean[] held = new boolean[messages.size()];
        int heldCount = 0;
        long checked = 0;
        // a curve at a time, so that memory holds one curve's dates, not the journal's
        for (Map.Entry<String, List<Integer>> curve : byCurve.entrySet()) {
            Map<LocalDate, SortedMap<Tenor, Double>> latest = new HashMap<>();
            journal.replayQuotes(null, curve.getKey(), q -> latest.put(q.date(), q.yieldsBp()));
            for (int i : curve.getValue()) {
                QuoteMessage m = messages.get(i);
                if (m.yieldsBp().equals(latest.get(m.date()))) {
                    held[i] = true;
                    heldCount++;
                } else {
                    latest.put(m.date(), m.yieldsBp()); // what the journal will hold once it is sent, for a later file's same date
                }
            }
            checked += curve.getValue().size();
            progress.accept(checked);
        }
        if (heldCount == 0) {
            return messages;
        }
        List<QuoteMessage> out = new ArrayList<>(messages.size() - heldCount);
        for (int i = 0; i < messages.size(); i++) {
            if (!held[i]) {
                out.add(messages.get(i));
            }
        }
        return out;
    }
}
