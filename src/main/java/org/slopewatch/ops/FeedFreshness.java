package org.slopewatch.ops;

import jakarta.enterprise.context.ApplicationScoped;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.LinkedHashMap;
import java.util.Map;
import org.slopewatch.ingest.IngestConfig;
import org.slopewatch.ingest.QuotePipeline;

/**
 * Whether each watched curve's feed is fresh: stale after the configured business hours without
 * an accepted quote, counted from start-up for a curve not heard from yet. The one place for the
 * rule; the health check and the stale-feed alerts both read it.
 */
@ApplicationScoped
public class FeedFreshness {

    /** One curve's feed now. */
    public record CurveFeed(String curve, Instant lastQuote, Instant quietSince, double quietBusinessHours, boolean stale) {
    }

    private final QuotePipeline pipeline;
    private final IngestConfig ingest;
    private final FeedConfig feeds;
    private final Clock clock;
    private final Instant started;

    FeedFreshness(QuotePipeline pipeline, IngestConfig ingest, FeedConfig feeds, Clock clock) {
        this.pipeline = pipeline;
        this.ingest = ingest;
        this.feeds = feeds;
        this.clock = clock;
        this.started = Instant.now(clock);
    }

    /** Every watched curve, in configuration order. */
    public Map<String, CurveFeed> now() {
        Instant now = Instant.now(clock);
        Map<String, Instant> last = pipeline.lastReceived();
        Map<String, CurveFeed> out = new LinkedHashMap<>();
        for (String curve : ingest.curves()) {
            Instant since = last.getOrDefault(curve, started);
            double quiet = BusinessHours.between(since, now);
            out.put(curve, new CurveFeed(curve, last.get(curve), since, quiet, quiet > feeds.staleAfterBusinessHours()));
        }
        return out;
    }

    /** Curve → the (UTC) date its feed went quiet when stale, null when fresh: what the stale-feed rules read. */
    public Map<String, LocalDate> staleSince() {
        Map<String, LocalDate> out = new LinkedHashMap<>();
        now().forEach((curve, feed) -> out.put(curve, feed.stale() ? LocalDate.ofInstant(feed.quietSince(), ZoneOffset.UTC) : null));
        return out;
    }
}
