package org.slopewatch.whatif;

import java.time.Instant;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;
import org.slopewatch.replay.WhatIfReport;

/**
 * One what-if run for the API, as it stands: waiting or running, done with its report, failed
 * with the reason, or abandoned by an instance that stopped while running it. The instance running
 * it holds one that its worker writes; every instance reads jobs back from the journal
 * ({@link WhatIfJobs#find}).
 */
public final class WhatIfJob {

    /**
     * What the API reports; a job waiting for the worker is already {@code running}, with no start
     * time; {@code abandoned}: still running as last written, but its instance has stopped writing.
     */
    public enum State {
        RUNNING, DONE, FAILED, ABANDONED;

        public String label() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    private final String id;
    private final String history;
    private final Instant submittedAt;
    private final AtomicLong done = new AtomicLong();
    private volatile long total;
    private volatile State state = State.RUNNING;
    private volatile Instant startedAt;
    private volatile Instant finishedAt;
    private volatile WhatIfReport result;
    private volatile String error;

    WhatIfJob(String id, String history, Instant submittedAt, long total) {
        this.id = id;
        this.history = history;
        this.submittedAt = submittedAt;
        this.total = total;
    }

    public String id() {
        return id;
    }

    /** What the job runs on: the daemon's journal, or an uploaded history. */
    public String history() {
        return history;
    }

    public State state() {
        return state;
    }

    /** Quote messages taken so far. */
    public long done() {
        return done.get();
    }

    /**
     * Quote messages to take. For the journal this is the count when the job started; quotes
     * stored while it runs are taken too, so it grows to what was done.
     */
    public long total() {
        return Math.max(total, done.get());
    }

    public Instant submittedAt() {
        return submittedAt;
    }

    public Instant startedAt() {
        return startedAt;
    }

    public Instant finishedAt() {
        return finishedAt;
    }

    /** The report once done, else null. */
    public WhatIfReport result() {
        return result;
    }

    /** Why it failed, else null. */
    public String error() {
        return error;
    }

    /** A job as the journal holds it, {@code state} as its reader judged it. */
    static WhatIfJob stored(String id, String history, State state, long done, long total, Instant submittedAt, Instant startedAt,
                            Instant finishedAt, WhatIfReport result, String error) {
        WhatIfJob job = new WhatIfJob(id, history, submittedAt, total);
        job.done.set(done);
        job.state = state;
        job.startedAt = startedAt;
        job.finishedAt = finishedAt;
        job.result = result;
        job.error = error;
        return job;
    }

    boolean finished() {
        return state != State.RUNNING;
    }

    void started(Instant at, long total) {
        this.total = total;
        this.startedAt = at;
    }

    void progress(long taken) {
        done.set(taken);
    }

    void succeeded(WhatIfReport report, Instant at) {
        this.result = report;
        this.finishedAt = at;
        this.state = State.DONE;
    }

    void failed(String reason, Instant at) {
        this.error = reason;
        this.finishedAt = at;
        this.state = State.FAILED;
    }
}
