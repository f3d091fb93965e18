package org.slopewatch.whatif;

import jakarta.annotation.PreDestroy;
import jakarta.inject.Singleton;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.Executors;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import org.jboss.logging.Logger;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalException;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.WhatIfRows;
import org.slopewatch.replay.CandidatePolicy;
import org.slopewatch.replay.SpreadFilter;
import org.slopewatch.replay.WhatIf;
import org.slopewatch.replay.WhatIfReport;

/**
 * Runs the API's what-ifs in the background, one at a time with a short queue: a what-if replays
 * the whole journal and takes a processor core while it runs, so a burst of requests must not
 * take the daemon's cores from the live pipeline. A request beyond the queue is refused rather
 * than left waiting.
 *
 * <p>Each job is a journal row ({@link WhatIfRows}), so that every instance on the journal answers
 * for it: the instance that accepted it runs it, writes its progress every {@link #HEARTBEAT} and
 * its report when it ends; a job still running whose heartbeat is older than
 * {@link #ABANDONED_AFTER} is shown as abandoned (its instance stopped). The newest {@link #KEEP}
 * jobs are kept, and any still running.
 */
@Singleton
public class WhatIfJobs {

    private static final Logger LOG = Logger.getLogger(WhatIfJobs.class);

    /** Jobs waiting behind the running one; more are refused. */
    static final int QUEUE = 4;
    /** Jobs kept in the journal, finished or not; older finished ones are forgotten. */
    static final int KEEP = 32;
    /** How often the running instance writes a job's progress and heartbeat. */
    static final Duration HEARTBEAT = Duration.ofSeconds(1);
    /** A running job whose heartbeat is older than this is abandoned: many heartbeats missed, not one slow write. */
    static final Duration ABANDONED_AFTER = Duration.ofSeconds(15);

    private final JournalWhatIf journal;
    private final WhatIfRows rows;
    private final Clock clock;
    private final ThreadPoolExecutor worker;
    private final ScheduledExecutorService heartbeat;
    // this instance's jobs until their end is written to the journal
    private final Map<String, WhatIfJob> jobs = new LinkedHashMap<>();

    WhatIfJobs(JournalReader reader, AlertHistory alerts, WhatIfRows rows, Clock clock) {
        this.journal = new JournalWhatIf(reader, alerts);
        this.rows = rows;
        this.clock = clock;
        this.worker = new ThreadPoolExecutor(1, 1, 0, TimeUnit.MILLISECONDS, new ArrayBlockingQueue<>(QUEUE), r -> {
            Thread t = new Thread(r, "slopewatch-what-if");
            t.setDaemon(true);
            t.setPriority(Thread.NORM_PRIORITY - 1); // the live pipeline comes first
            return t;
        });
        this.heartbeat = Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "slopewatch-what-if-heartbeat");
            t.setDaemon(true);
            return t;
        });
        heartbeat.scheduleWithFixedDelay(this::beat, HEARTBEAT.toMillis(), HEARTBEAT.toMillis(), TimeUnit.MILLISECONDS);
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

    /** A job as the journal holds it, whichever instance runs or ran it. */
    public Optional<WhatIfJob> find(String id) {
        Instant now = clock.instant();
        return rows.find(id).map(r -> {
            WhatIfJob.State state = WhatIfJob.State.valueOf(r.state().toUpperCase(java.util.Locale.ROOT));
            if (state == WhatIfJob.State.RUNNING && r.heartbeatAt().isBefore(now.minus(ABANDONED_AFTER))) {
                state = WhatIfJob.State.ABANDONED;
            }
            return WhatIfJob.stored(r.id(), r.history(), state, r.done(), r.total(), r.submittedAt(), r.startedAt(), r.finishedAt(),
                    WhatIfResults.read(r.result()), r.error());
        });
    }

    @FunctionalInterface
    private interface Work {
        WhatIfReport run(WhatIfJob job);
    }

    private synchronized Optional<WhatIfJob> submit(String history, long total, Work work) {
        if (worker.getQueue().remainingCapacity() == 0) {
            return Optional.empty(); // refused before anything is written
        }
        WhatIfJob job = new WhatIfJob(UUID.randomUUID().toString(), history, clock.instant(), total);
        // the row first: the worker writes the end into it
        rows.accepted(job.id(), job.history(), job.submittedAt(), total);
        jobs.put(job.id(), job);
        try {
            worker.execute(() -> run(job, work));
        } catch (RejectedExecutionException e) {
            job.failed("refused: what-ifs are queued to the limit", clock.instant());
            writeEnd(job);
            return Optional.empty();
        }
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
            writeEnd(job);
            throw e;
        }
        writeEnd(job);
    }

    /** Writes a finished job's end; kept in memory for the next heartbeat to try again when the journal refuses. */
    private void writeEnd(WhatIfJob job) {
        try {
            rows.ended(job.id(), job.state().label(), job.done(), job.total(), job.startedAt(), job.finishedAt(),
                    job.result() == null ? null : WhatIfResults.write(job.result()), job.error());
            synchronized (this) {
                jobs.remove(job.id());
            }
        } catch (JournalException e) {
            LOG.warnf("what-if %s: cannot write its end to the journal yet (%s); trying again", job.id(), e.getMessage());
        }
    }

    /** Every {@link #HEARTBEAT}: the progress of this instance's jobs, and the ends not written yet. */
    private void beat() {
        List<WhatIfJob> mine;
        synchronized (this) {
            mine = List.copyOf(jobs.values());
        }
        for (WhatIfJob job : mine) {
            // nothing may escape: a scheduled task that throws is never run again
            try {
                if (job.finished()) {
                    writeEnd(job);
                } else {
                    rows.beat(job.id(), job.done(), job.total(), job.startedAt());
                }
            } catch (JournalException e) {
                LOG.debugf("what-if %s: heartbeat not written (%s)", job.id(), e.getMessage());
            } catch (RuntimeException e) {
                LOG.warnf(e, "what-if %s: heartbeat failed", job.id());
            }
        }
    }

    private void forgetOldJobs() {
        try {
            rows.forgetBeyond(KEEP, clock.instant().minus(ABANDONED_AFTER));
        } catch (JournalException e) {
            LOG.debugf("old what-if jobs not forgotten yet (%s)", e.getMessage());
        }
    }

    /** Stops the worker; a job it was running shows as abandoned once its heartbeat is old. */
    @PreDestroy
    void stop() {
        worker.shutdownNow();
        heartbeat.shutdownNow();
    }
}
