package org.slopewatch.pipeline;

import jakarta.enterprise.context.ApplicationScoped;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Whether each watched curve's feed is fresh: stale after the configured business hours without
 * an accepted quote, counted from the curve's latest quote in the journal (whichever instance
 * journalled it, before a restart too), or from start-up for a curve never heard from. The one
 * place for the rule; the health check and the stale-feed alerts both read it. A curve with no
 * quote at all is also reported as never quoted ({@link CurveFeed#neverQuoted()}): the health
 * check counts it as not fresh from the start.
 *
 * <p>A curve another instance owns (several instances on one consumer group) is never stale here:
 * its quotes go to the other instance, which answers for its feed.
 */
@ApplicationScoped
public class FeedFreshness {

    /** One curve's feed now; {@code lastQuote} null when the journal holds no quote of the curve. */
    public record CurveFeed(String curve, boolean ownedHere, Instant lastQuote, Instant quietSince, double quietBusinessHours,
                            boolean stale) {

        /**
         * An owned curve with no quote at all, in the journal or since start-up: not fresh, whatever
         * the business hours say (a feed that never started is not a quiet one), though its stale
         * alert still waits for the limit, counted from start-up.
         */
        public boolean neverQuoted() {
            return ownedHere && lastQuote == null;
        }
    }

    private final QuotePipeline pipeline;
    private final CurveOwnership ownership;
    private final IngestConfig ingest;
    private final FeedConfig feeds;
    private final Clock clock;
    private final Instant started;

    FeedFreshness(QuotePipeline pipeline, CurveOwnership ownership, IngestConfig ingest, FeedConfig feeds, Clock clock) {
        this.pipeline = pipeline;
        this.ownership = ownership;
        this.ingest = ingest;
        this.feeds = feeds;
        this.clock = clock;
        this.started = Instant.now(clock);
    }

    /** Every watched curve, in configuration order. */
    public Map<String, CurveFeed> now() {
        return assess(ingest.curves(), pipeline.lastReceived(), started, Instant.now(clock), feeds.staleAfterBusinessHours(), ownership);
    }

    /** When the curve's latest accepted quote was journalled, or null before its first. */
    public Instant lastQuote(String curve) {
        return pipeline.lastReceived(curve);
    }

    /**
     * The rule itself: each curve's quiet time runs from its last quote, or from {@code started}
     * when it has none, in business hours; an owned curve quiet for longer than the limit is stale.
     */
    static Map<String, CurveFeed> assess(List<String> curves, Map<String, Instant> lastQuote, Instant started, Instant now,
                                         double staleAfterBusinessHours, CurveOwnership ownership) {
        Map<String, CurveFeed> out = new LinkedHashMap<>();
        for (String curve : curves) {
            Instant since = lastQuote.getOrDefault(curve, started);
            double quiet = BusinessHours.between(since, now);
            boolean owned = ownership.owns(curve);
            out.put(curve, new CurveFeed(curve, owned, lastQuote.get(curve), since, quiet, owned && quiet > staleAfterBusinessHours));
        }
        return out;
    }

    /**
     * Owned curve → the (UTC) date its feed went quiet when stale, null when fresh: what the
     * stale-feed rules read. Curves owned elsewhere are left out, so no rule here decides on them.
     */
    public Map<String, LocalDate> staleSince() {
        return staleSince(now());
    }

    static Map<String, LocalDate> staleSince(Map<String, CurveFeed> feeds) {
        Map<String, LocalDate> out = new LinkedHashMap<>();
        feeds.forEach((curve, feed) -> {
            if (feed.ownedHere()) {
                out.put(curve, feed.stale() ? LocalDate.ofInstant(feed.quietSince(), ZoneOffset.UTC) : null);
            }
        });
        return out;
    }
}
