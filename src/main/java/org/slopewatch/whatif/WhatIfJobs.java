package org.slopewatch.whatif;

import jakarta.annotation.PreDestroy;
import jakarta.inject.Singleton;
import java.time.Clock;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import org.jboss.logging.Logger;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.replay.CandidatePolicy;
import org.slopewatch.replay.SpreadFilter;
import org.slopewatch.replay.WhatIf;
import org.slopewatch.replay.WhatIfReport;

/**
 * Runs the API's what-ifs in the background, one at a time with a short queue: a what-if replays
 * the whole journal and takes a processor core while it runs, so a burst of requests must not
 * take the daemon's cores from the live pipeline. A request beyond the queue is refused rather
 * than left waiting. Finished jobs are kept for a while so their results can be fetched.
 */
@Singleton
public class WhatIfJobs {

    private static final Logger LOG = Logger.getLogger(WhatIfJobs.class);

    /** Jobs waiting behind the running one; more are refused. */
    static final int QUEUE = 4;
    /** Jobs remembered, finished or not; the oldest finished ones are forgotten first. */
    static final int KEEP = 32;

    private final JournalWhatIf journal;
    private final Clock clock;
    private final ThreadPoolExecutor worker;
    private final Map<String, WhatIfJob> jobs = new LinkedHashMap<>();

    WhatIfJobs(JournalReader reader, AlertHistory alerts, Clock clock) {
        this.journal = new JournalWhatIf(reader, alerts);
        this.clock = clock;
        this.worker = new ThreadPoolExecutor(1, 1, 0, TimeUnit.MILLISECONDS, new ArrayBlockingQueue<>(QUEUE), r -> {
            Thread t = new Thread(r, "slopewatch-what-if");
            t.setDaemon(true);
            t.setPriority(Thread.NORM_PRIORITY - 1); // the live pipeline comes first
            return t;
        });
    }

    /** A what-if on the daemon's journal; empty when the queue is full. */
    public Optional<WhatIfJob> onJournal(CandidatePolicy policy, SpreadFilter filter) {
        return submit("journal", 0, job -> {
            job.started(clock.instant(), journal.quoteCount());
            return journal.run("the daemon's journal", policy, filter, job::progress);
        });
    }

    /** A what-if on an uploaded history, already read; empty when the queue is full. */
    public Optional<WhatIfJob> onHistory(CandidatePolicy policy, SpreadFilter filter, String source, List<CurveSnapshot> snapshots) {
        List<CurveSnapshot> history = List.copyOf(snapshots);
        return submit(source, history.size(), job -> {
            job.started(clock.instant(), history.size());
            WhatIf whatIf = new WhatIf(policy, filter);
            for (CurveSnapshot s : history) {
                whatIf.snapshot(s);
                job.progress(whatIf.quotes());
            }
            return whatIf.report(source, null);
        });
    }

    public synchronized Optional<WhatIfJob> find(String id) {
        return Optional.ofNullable(jobs.get(id));
    }

    @FunctionalInterface
    private interface Work {
        WhatIfReport run(WhatIfJob job);
    }

    private synchronized Optional<WhatIfJob> submit(String history, long total, Work work) {
        WhatIfJob job = new WhatIfJob(UUID.randomUUID().toString(), history, clock.instant(), total);
        try {
            worker.execute(() -> run(job, work));
        } catch (RejectedExecutionException e) {
            return Optional.empty();
        }
        jobs.put(job.id(), job);
        forgetOldJobs();
        return Optional.of(job);
    }

    private void run(WhatIfJob job, Work work) {
        try {
            job.succeeded(work.run(job), clock.instant());
            LOG.infof("what-if %s done: %d quote messages", job.id(), job.done());
        } catch (RuntimeException e) {
            LOG.warnf(e, "what-if %s failed", job.id());
            job.failed(e.getMessage() == null ? e.toString() : e.getMessage(), clock.instant());
        } catch (Error e) {
            // say so to whoever polls, rather than leave the job running for ever
            job.failed("stopped: " + e, clock.instant());
            throw e;
        }
    }

    private void forgetOldJobs() {
        List<String> finished = new ArrayList<>();
        jobs.values().stream().filter(WhatIfJob::finished).forEach(j -> finished.add(j.id()));
        Iterator<String> oldest = finished.iterator();
        while (jobs.size() > KEEP && oldest.hasNext()) {
            jobs.remove(oldest.next());
        }
    }

    @PreDestroy
    void stop() {
        worker.shutdownNow();
    }
}
