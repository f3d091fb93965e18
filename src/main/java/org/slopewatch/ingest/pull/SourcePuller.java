package org.slopewatch.ingest.pull;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import org.jboss.logging.Logger;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.delivery.DeliveryOutcome;
import org.slopewatch.delivery.RetryDecision;
import org.slopewatch.delivery.RetryPolicy;
import org.slopewatch.ingest.CsvQuoteDecoder;
import org.slopewatch.journal.SourceFetches;
import org.slopewatch.pipeline.PulledSources;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.pipeline.Reject;

/**
 * One pulled source: fetches its publication, reads it as any history file, and hands the pipeline
 * only the dates it does not hold yet or holds with other yields. A failed fetch is tried again on
 * the one retry policy of the daemon, up to the next scheduled fetch; every attempt is journalled.
 *
 * <p>The pipeline drops a repeated message only by its id, and a publication carries none; so the
 * comparison with what is held is made here, against the pipeline's curve book, which is what the
 * journal holds (rebuilt from it on start). A past date with other yields goes through as any late
 * quote does, and the pipeline journals the revision of the transitions it changes.
 */
final class SourcePuller {

    /** The origin of pulled quotes in the journal and the metrics; the source's name is in each quote's {@code source}. */
    static final String ORIGIN = "pull";
    /** Yields read back from the journal may differ from those just parsed by a rounding; less than this is the same. */
    private static final double SAME_BP = 1e-6;

    private static final Logger LOG = Logger.getLogger(SourcePuller.class);

    /** Waits until an instant: the scheduler's thread in the daemon, a recorded wait in a test. */
    interface Pause {
        void until(Instant at) throws InterruptedException;
    }

    private final String name;
    private final SourcesConfig.Source config;
    private final HttpFetcher fetcher;
    private final CsvQuoteDecoder decoder;
    private final QuotePipeline pipeline;
    private final SourceFetches fetches;
    private final PulledSources status;
    private final RetryPolicy retry;
    private final Clock clock;
    private final Pause pause;

    SourcePuller(String name, SourcesConfig.Source config, HttpFetcher fetcher, CsvQuoteDecoder decoder, QuotePipeline pipeline,
                 SourceFetches fetches, PulledSources status, RetryPolicy retry, Clock clock, Pause pause) {
        this.name = name;
        this.config = config;
        this.fetcher = fetcher;
        this.decoder = decoder;
        this.pipeline = pipeline;
        this.fetches = fetches;
        this.status = status;
        this.retry = retry;
        this.clock = clock;
        this.pause = pause;
        status.register(name, config.curve().orElse(null), config.every());
    }

    /** One scheduled fetch, with its retries; one at a time, so that two never compare against the same book. */
    synchronized void pull() throws InterruptedException {
        Instant first = clock.instant();
        // past this the next scheduled fetch is due, and tries afresh
        Instant nextScheduled = first.plus(config.every());
        for (int attempt = 1; ; attempt++) {
            Instant started = clock.instant();
            Fetched answer = fetcher.fetch(fetches.validators(name).orElse(null));
            String problem = handle(answer, started);
            if (problem == null) {
                return;
            }
            DeliveryOutcome outcome = answer instanceof Fetched.Failed f && f.retryable()
                    ? new DeliveryOutcome.RetryLater(problem) : new DeliveryOutcome.FailedForGood(problem);
            RetryDecision next = retry.decide(outcome, attempt, first);
            if (next instanceof RetryDecision.RetryAt at && at.at().isBefore(nextScheduled)) {
                LOG.warnf("source %s: %s", name, at.reason());
                pause.until(at.at());
                continue;
            }
            LOG.warnf("source %s: %s; the next scheduled fetch is in %s", name, next.reason(), human(config.every()));
            return;
        }
    }

    /** Journals one fetch and forwards what is new; returns why it failed, or null. */
    private String handle(Fetched answer, Instant started) {
        String curve = config.curve().orElse(null);
        if (answer instanceof Fetched.NotModified nm) {
            fetches.record(new SourceFetches.Fetch(name, curve, started, nm.status(), "not-modified", 0, 0, 0, 0,
                    "not modified since the last publication read (RFC 9110, 15.4.5): nothing forwarded", null, null));
            status.succeeded(name, clock.instant());
            return null;
        }
        if (answer instanceof Fetched.Failed f) {
            fetches.record(new SourceFetches.Fetch(name, curve, started, f.status(), "failed", 0, 0, 0, 0, f.reason(), null, null));
            status.failed(name, f.reason());
            return f.reason();
        }
        Fetched.Body body = (Fetched.Body) answer;
        QuoteBatch read = decoder.decode(ORIGIN, name, body.bytes(), body.charset(), curve, config.unit());
        if (read.messages().isEmpty() && !read.rejects().isEmpty()) {
            // the publication as a whole was refused (or every row of it): nothing of it goes on, the refusal is journalled
            pipeline.process(List.of(new QuoteBatch(ORIGIN, List.of(), read.rejects())));
            String reason = "refused: " + read.rejects().get(0).detail();
            fetches.record(new SourceFetches.Fetch(name, curve, started, body.status(), "refused", 0, 0, 0, read.rejects().size(),
                    reason, null, null));
            status.failed(name, reason);
            return reason;
        }
        List<QuoteMessage> forward = new ArrayList<>();
        int fresh = 0;
        int revised = 0;
        int same = 0;
        for (QuoteMessage m : read.messages()) {
            CurveSnapshot held = pipeline.curve(m.curve(), m.date());
            if (held == null) {
                fresh++;
            } else if (holds(held, m.yieldsBp())) {
                same++;
                continue;
            } else {
                revised++;
            }
            forward.add(new QuoteMessage(null, ORIGIN + ":" + name, null, m.curve(), m.date(), m.yieldsBp()));
        }
        // publishers list dates newest first; the monitors take them oldest first, as they happened
        forward.sort(Comparator.comparing(QuoteMessage::curve).thenComparing(QuoteMessage::date));
        if (!forward.isEmpty() || !read.rejects().isEmpty()) {
            pipeline.process(List.of(new QuoteBatch(ORIGIN, forward, read.rejects())));
        }
        String detail = read.rejects().isEmpty() ? null
                : read.rejects().size() + " row(s) rejected, the first: " + describe(read.rejects().get(0));
        fetches.record(new SourceFetches.Fetch(name, curve, started, body.status(), "forwarded", fresh, revised, same,
                read.rejects().size(), detail, body.etag(), body.lastModified()));
        status.succeeded(name, clock.instant());
        LOG.infof("source %s: %d date(s) new, %d revised, %d unchanged, %d rejected", name, fresh, revised, same, read.rejects().size());
        return null;
    }

    /** Whether the book already holds every yield of the quote, to within a rounding. */
    private static boolean holds(CurveSnapshot held, Map<Tenor, Double> yieldsBp) {
        for (Map.Entry<Tenor, Double> e : yieldsBp.entrySet()) {
            double h = held.yieldBp(e.getKey());
            if (Double.isNaN(h) || Math.abs(h - e.getValue()) > SAME_BP) {
                return false;
            }
        }
        return true;
    }

    private static String describe(Reject r) {
        return r.reason().code() + ": " + r.detail();
    }

    private static String human(Duration d) {
        return d.toString().substring(2).toLowerCase(java.util.Locale.ROOT);
    }
}
