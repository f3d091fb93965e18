package org.slopewatch.ingest.demo;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.function.LongConsumer;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;

/**
 * Plays a {@link DemoScenario} as quote messages, one batch per business day, each message with
 * a deterministic id ({@code demo:GOVT-A:2026-01-05}) so that a day sent twice is a duplicate.
 * Resuming after a restart skips the days the journal already holds.
 *
 * <p>Pacing is the caller's: {@code pause} is told the index of each day before it is sent.
 */
public final class DemoFeed {

    /** Where each day's batch goes; returns when the batch has been handled. */
    @FunctionalInterface
    public interface Sink {
        void send(QuoteBatch batch) throws Exception;
    }

    private final DemoScenario scenario;

    public DemoFeed(DemoScenario scenario) {
        this.scenario = scenario;
    }

    /**
     * Sends days until {@code days} have been sent or the thread is interrupted.
     *
     * @param after   days on or before this date are skipped (already journalled), or null
     * @param days    how many days to send at most ({@code Long.MAX_VALUE} to keep going)
     * @param pause   called with each day's index before it is sent
     * @return the last date sent, or null
     */
    public LocalDate play(LocalDate after, long days, LongConsumer pause, Sink sink) throws Exception {
        LocalDate last = null;
        long sent = 0;
        for (Iterator<DemoDay> it = scenario.iterator(); it.hasNext() && sent < days && !Thread.currentThread().isInterrupted(); ) {
            DemoDay day = it.next();
            if (after != null && !day.date().isAfter(after)) {
                continue;
            }
            pause.accept(day.index());
            sink.send(batch(day));
            last = day.date();
            sent++;
        }
        return last;
    }

    static QuoteBatch batch(DemoDay day) {
        List<QuoteMessage> messages = new ArrayList<>();
        for (CurveSnapshot s : day.snapshots()) {
            messages.add(new QuoteMessage("demo:" + s.curve() + ":" + s.date(), "demo", null, s.curve(), s.date(), s.asMap()));
        }
        return new QuoteBatch("demo", messages, List.of());
    }
}
