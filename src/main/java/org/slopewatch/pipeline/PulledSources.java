package org.slopewatch.pipeline;

import jakarta.inject.Singleton;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.function.Consumer;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;

/**
 * How each pulled source is doing: when it last answered with a publication or a 304, how many
 * fetches failed in a row since and in all. The puller writes it after every fetch; health and
 * metrics read it. It sits here rather than with the puller because operations may read the
 * pipeline's state but not the edges.
 */
@Singleton
public class PulledSources {

    /**
     * @param every           how often the source is fetched
     * @param lastSuccess     the end of the last fetch that came to an answer (200 or 304), or null before the first
     * @param failuresInARow  failed fetches since the last success
     * @param failures        failed fetches since start-up
     * @param lastProblem     why the last fetch failed, or null
     */
    public record Status(String source, String curve, Duration every, Instant lastSuccess, int failuresInARow, long failures, String lastProblem) {

        public Optional<Instant> lastSuccessAt() {
            return Optional.ofNullable(lastSuccess);
        }

        /**
         * Failing: the latest fetch failed and no answer came within the source's interval (never, or longer
         * ago than {@code every}), so the publication may have moved on without the daemon. One failure after
         * a recent answer is left to the retries and the next scheduled fetch.
         */
        public boolean failing(Instant now) {
            return failuresInARow > 0 && (lastSuccess == null || Duration.between(lastSuccess, now).compareTo(every) > 0);
        }
    }

    private final Map<String, Status> sources = new ConcurrentHashMap<>();
    private final List<Consumer<String>> watchers = new CopyOnWriteArrayList<>();

    /** Registers a source before its first fetch, so that health and metrics show it from start-up. */
    public void register(String source, String curve, Duration every) {
        if (sources.putIfAbsent(source, new Status(source, curve, every, null, 0, 0, null)) == null) {
            watchers.forEach(w -> w.accept(source));
        }
    }

    /**
     * Calls {@code onSource} with every source registered, now and from now on: the metrics register
     * their series whichever bean starts first.
     */
    public synchronized void eachSource(Consumer<String> onSource) {
        watchers.add(onSource);
        sources.keySet().forEach(onSource);
    }

    public void succeeded(String source, Instant at) {
        sources.computeIfPresent(source, (k, s) -> new Status(k, s.curve(), s.every(), at, 0, s.failures(), null));
    }

    public void failed(String source, String problem) {
        sources.computeIfPresent(source, (k, s) -> new Status(k, s.curve(), s.every(), s.lastSuccess(), s.failuresInARow() + 1,
                s.failures() + 1, problem));
    }

    public Optional<Status> status(String source) {
        return Optional.ofNullable(sources.get(source));
    }

    /** Every registered source by name, in name order. */
    public Map<String, Status> all() {
        return new TreeMap<>(sources);
    }
}
