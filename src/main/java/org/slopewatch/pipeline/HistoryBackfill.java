package org.slopewatch.pipeline;

import java.util.List;
import java.util.function.LongConsumer;

/**
 * Past quotes loaded into the journal through the daemon's own step: the messages go to
 * {@link QuotePipeline#process} many at a time, so that each step's inserts are batched in one
 * transaction, and the journal ends as it would had each message come to the daemon alone (the
 * pipeline decides after each message, never once per step).
 */
public final class HistoryBackfill {

    /** Snapshots per step when the caller does not say: large enough that commits are rare, small enough for a modest heap. */
    public static final int DEFAULT_STEP = 5_000;

    private final QuotePipeline pipeline;
    private final String origin;
    private final int step;

    /** What a backfill did: messages accepted and dropped as duplicates, transitions decided, steps committed. */
    public record Totals(long accepted, long duplicates, long transitions, long steps) {
    }

    /**
     * @param origin how the journal names where the quotes came from (the daemon's edges say {@code http}, {@code kafka}…)
     * @param step   messages per step, at least 1
     */
    public HistoryBackfill(QuotePipeline pipeline, String origin, int step) {
        if (step < 1) {
            throw new IllegalArgumentException("a backfill step needs at least one snapshot, not " + step);
        }
        this.pipeline = pipeline;
        this.origin = origin;
        this.step = step;
    }

    /**
     * Feeds the messages in order, {@code step} at a time. A step that fails leaves the journal as the
     * steps before it left it (each is one transaction) and the failure is passed on.
     *
     * @param progress told the number of messages fed so far after each step
     */
    public Totals feed(List<QuoteMessage> messages, LongConsumer progress) {
        long accepted = 0;
        long duplicates = 0;
        long transitions = 0;
        long steps = 0;
        for (int from = 0; from < messages.size(); from += step) {
            int to = Math.min(messages.size(), from + step);
            BatchOutcome outcome = pipeline.process(List.of(new QuoteBatch(origin, messages.subList(from, to), List.of())));
            accepted += outcome.accepted();
            duplicates += outcome.duplicates();
            transitions += outcome.transitions();
            steps++;
            progress.accept(to);
        }
        return new Totals(accepted, duplicates, transitions, steps);
    }
}
