package org.slopewatch.alerting;

import jakarta.inject.Singleton;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Each channel's run of delivery attempts that did not deliver, as this daemon's
 * {@link AlertDispatcher} made them: how many in a row since the channel last delivered, when the
 * run began and when its latest attempt was, and how many deliveries it gave up on meanwhile. A
 * delivered attempt ends the run.
 *
 * <p>A channel is failing ({@link Run#failing}) while its latest attempt is recent and either the
 * run is long enough or a delivery was given up on in it: one refused connection is a blip, three
 * in a row are an outage, and a notice given up on is lost to the desk at once.
 *
 * <p>Kept in memory: what this instance's workers saw since start. The attempts themselves, with
 * their reasons, are in the journal; after a restart the pending deliveries are tried again, and a
 * channel still failing shows again after its next attempts.
 */
@Singleton
public class ChannelFailures {

    /** What an attempt came to, as the dispatcher journals it. */
    public enum Outcome { DELIVERED, RETRY, FAILED }

    /**
     * One channel's current run; {@code undelivered} 0 means its latest attempt delivered.
     *
     * @param lost deliveries given up on (failed for good) during the run
     */
    public record Run(String channel, int undelivered, int lost, Instant since, Instant latest, Outcome latestOutcome) {

        /**
         * The rule: attempts not delivered at the end of the channel's history, the latest no
         * older than {@code within}, and at least {@code afterAttempts} of them or one delivery
         * given up on.
         */
        public boolean failing(Instant now, Duration within, int afterAttempts) {
            return undelivered > 0 && !latest.isBefore(now.minus(within)) && (undelivered >= afterAttempts || lost > 0);
        }

        Run next(Outcome outcome, Instant at) {
            if (outcome == Outcome.DELIVERED) {
                return new Run(channel, 0, 0, null, at, outcome);
            }
            return new Run(channel, undelivered + 1, lost + (outcome == Outcome.FAILED ? 1 : 0), undelivered == 0 ? at : since, at, outcome);
        }
    }

    private final Map<String, Run> runs = new TreeMap<>();

    /** Called by the dispatcher after each attempt it journalled. */
    synchronized void attempted(String channel, Outcome outcome, Instant at) {
        Run before = runs.getOrDefault(channel, new Run(channel, 0, 0, null, at, Outcome.DELIVERED));
        runs.put(channel, before.next(outcome, at));
    }

    /** Every channel attempted since start, by name. */
    public synchronized List<Run> runs() {
        return List.copyOf(runs.values());
    }
}
