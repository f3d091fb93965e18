package org.slopewatch.ingest.pull;

import io.quarkus.runtime.Startup;
import io.smallrye.config.ConfigMapping;
import io.quarkus.scheduler.Scheduled.ConcurrentExecution;
import io.quarkus.scheduler.Scheduler;
import jakarta.inject.Singleton;
import java.io.IOException;
import java.net.URI;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.jboss.logging.Logger;
import org.slopewatch.delivery.RetryPolicy;
import org.slopewatch.history.SeriesMap;
import org.slopewatch.ingest.CsvQuoteDecoder;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.journal.SourceFetches;
import org.slopewatch.pipeline.PulledSources;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * Fetches each configured source ({@code slopewatch.sources.<name>.*}) at its interval on the
 * Quarkus scheduler, the first time at start-up. A fetch still running (retries included) when the
 * next is due is skipped, not queued. Every problem of the configuration is reported at once, and
 * stops start-up.
 */
@Startup
@Singleton
public class SourceSchedule {

    private static final Logger LOG = Logger.getLogger(SourceSchedule.class);

    private final Map<String, SourcePuller> pullers = new TreeMap<>();

    SourceSchedule(SourcesConfig config, QuoteDecoder quotes, IngestRules rules, QuotePipeline pipeline, SourceFetches fetches,
                   PulledSources status, RetryPolicy retry, Clock clock, Scheduler scheduler) {
        List<String> problems = new ArrayList<>();
        // the messages name each setting as written; the prefix is the mapping's, in one place
        String prefix = SourcesConfig.class.getAnnotation(ConfigMapping.class).prefix();
        SourcePuller.Pause sleep = at -> {
            long millis = Duration.between(clock.instant(), at).toMillis();
            if (millis > 0) {
                Thread.sleep(millis);
            }
        };
        for (Map.Entry<String, SourcesConfig.Source> e : new TreeMap<>(config.sources()).entrySet()) {
            String name = e.getKey();
            SourcesConfig.Source source = e.getValue();
            try {
                if (source.every().isNegative() || source.every().isZero()) {
                    throw new IllegalArgumentException("every must be positive, not " + source.every());
                }
                HttpFetcher fetcher = new HttpFetcher(URI.create(source.url().trim()), source.timeout(), source.maxBytes());
                SeriesMap series = SeriesMap.readOrNone(source.seriesMap().map(Path::of).orElse(null));
                pullers.put(name, new SourcePuller(name, source, fetcher, new CsvQuoteDecoder(quotes, rules, series), pipeline, fetches,
                        status, retry, clock, sleep));
            } catch (IllegalArgumentException | IOException ex) {
                // the message never repeats the URL: it may carry a token
                problems.add(prefix + "." + name + ": " + (ex instanceof IOException ? "series-map: " : "") + ex.getMessage());
            }
        }
        if (!problems.isEmpty()) {
            throw new IllegalStateException("pulled sources misconfigured: " + String.join("; ", problems));
        }
        pullers.forEach((name, puller) -> {
            String every = config.sources().get(name).every().toString();
            scheduler.newJob("slopewatch-source-" + name).setInterval(every).setConcurrentExecution(ConcurrentExecution.SKIP)
                    .setTask(execution -> run(name, puller)).schedule();
        });
        if (!pullers.isEmpty()) {
            LOG.infof("pulling %d source(s): %s", pullers.size(), String.join(", ", pullers.keySet()));
        }
    }

    private static void run(String name, SourcePuller puller) {
        try {
            puller.pull();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } catch (RuntimeException e) {
            // the journal may be down; the next scheduled fetch tries again, and nothing was forwarded in part
            LOG.warnf("source %s: the fetch could not be completed, will try at the next interval: %s", name, e.getMessage());
        }
    }

    /** The source's fetch now, out of schedule; for tests and a future command. Returns once it is done. */
    public void pullNow(String name) throws InterruptedException {
        SourcePuller p = pullers.get(name);
        if (p == null) {
            throw new IllegalArgumentException("no source named " + name);
        }
        p.pull();
    }
}
