package org.slopewatch.whatif;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.WhatIfRows;
import org.slopewatch.replay.CandidatePolicy;
import org.slopewatch.replay.SpreadFilter;
import org.slopewatch.replay.WhatIfReport;
import org.slopewatch.testsupport.MutableClock;

/**
 * What-if jobs across instances on one journal: a job accepted by one instance is read, state,
 * progress and report, from another; a job whose instance stopped shows as abandoned once its
 * heartbeat is older than {@link WhatIfJobs#ABANDONED_AFTER}. Written once and run on H2
 * ({@link WhatIfJobsAcrossInstancesTest}) and PostgreSQL ({@link WhatIfJobsAcrossInstancesPostgresTest}).
 *
 * <p>Expected notices, from the policy tried ({@code policies/whatif-30-days.yaml}: 10Y−3M
 * inverted below 0 bp, confirmed after 30 calendar days inverted) on GOVT-B 20 bp inverted from
 * 2 January 2026: first inversion on 2 January, confirmation on 2 February, the first observation
 * 30 days on (1 February is a Sunday); the same history and dates as {@code web.WhatIfApiTest}.
 */
abstract class WhatIfJobsAcrossInstancesChecks {

    private final List<AutoCloseable> open = new ArrayList<>();
    private final List<WhatIfJobs> started = new ArrayList<>();

    /** Two connection pools on one new, empty journal, as two daemons would open it. */
    protected abstract List<AgroalDataSource> oneJournalTwice();

    protected final <T extends AutoCloseable> T closeAfterTest(T resource) {
        open.add(resource);
        return resource;
    }

    @AfterEach
    void close() throws Exception {
        started.forEach(WhatIfJobs::stop);
        Collections.reverse(open);
        for (AutoCloseable c : open) {
            c.close();
        }
        open.clear();
    }

    private WhatIfJobs instance(AgroalDataSource ds, Clock clock) {
        WhatIfJobs jobs = new WhatIfJobs(new JournalReader(ds), new AlertHistory(ds), new WhatIfRows(ds, clock), clock);
        started.add(jobs);
        return jobs;
    }

    private static CurveSnapshot govtB(String date, double threeMonth, double tenYear) {
        return CurveSnapshot.of("GOVT-B", LocalDate.parse(date), Map.of(Tenor.months(3), threeMonth, Tenor.years(10), tenYear));
    }

    @Test
    void aJobAcceptedByOneInstanceIsReadFromTheOther() throws Exception {
        List<AgroalDataSource> pools = oneJournalTwice();
        WhatIfJobs a = instance(pools.get(0), Clock.systemUTC());
        WhatIfJobs b = instance(pools.get(1), Clock.systemUTC());
        CandidatePolicy policy = CandidatePolicy.parse("policy", Files.readAllBytes(Path.of("src/test/resources/policies/whatif-30-days.yaml")));
        List<CurveSnapshot> history = List.of(govtB("2026-01-02", 500, 480), govtB("2026-01-05", 500, 480), govtB("2026-02-02", 500, 480),
                govtB("2026-02-03", 500, 490));

        WhatIfJob accepted = a.onHistory(policy, SpreadFilter.of(List.of()), "history", history).orElseThrow();

        assertThat(b.find(accepted.id())).as("the job as B reads it the moment A accepted it").isPresent();
        WhatIfJob seen = Awaitility.await("B reads the job done").atMost(Duration.ofSeconds(30)).pollInterval(Duration.ofMillis(50))
                .until(() -> b.find(accepted.id()).orElseThrow(), j -> j.state() != WhatIfJob.State.RUNNING);
        assertThat(seen.state()).as(String.valueOf(seen.error())).isEqualTo(WhatIfJob.State.DONE);
        assertThat(seen.done()).as("snapshots taken").isEqualTo(4);
        assertThat(seen.total()).isEqualTo(4);
        assertThat(seen.history()).isEqualTo("history");
        assertThat(seen.submittedAt()).isNotNull();
        assertThat(seen.startedAt()).isNotNull();
        assertThat(seen.finishedAt()).isNotNull();
        WhatIfReport report = seen.result();
        assertThat(report.wouldFire()).extracting(n -> n.rule() + " " + n.marketDate())
                .containsExactly("first-inversion 2026-01-02", "inversion-confirmed 2026-02-02");
        assertThat(report).as("the report B reads is the one A made").isEqualTo(accepted.result());
    }

    @Test
    void aJobWhoseInstanceStoppedIsAbandonedOnceItsHeartbeatIsOld() {
        List<AgroalDataSource> pools = oneJournalTwice();
        Instant t0 = Instant.parse("2026-03-02T09:00:00Z");
        MutableClock clock = new MutableClock(t0);
        // what an instance leaves when it dies mid-run: the row it wrote on accepting, and its last heartbeat
        WhatIfRows dead = new WhatIfRows(pools.get(0), clock);
        dead.accepted("job-of-a-dead-instance", "journal", t0, 120);
        dead.beat("job-of-a-dead-instance", 40, 120, t0);
        WhatIfJobs b = instance(pools.get(1), clock);

        clock.advance(WhatIfJobs.ABANDONED_AFTER.minusSeconds(1));
        WhatIfJob recent = b.find("job-of-a-dead-instance").orElseThrow();
        assertThat(recent.state()).as("a heartbeat younger than the bound").isEqualTo(WhatIfJob.State.RUNNING);
        assertThat(recent.done()).isEqualTo(40);

        clock.advance(Duration.ofSeconds(2));
        WhatIfJob old = b.find("job-of-a-dead-instance").orElseThrow();
        assertThat(old.state()).as("a heartbeat older than the bound").isEqualTo(WhatIfJob.State.ABANDONED);
        assertThat(old.state().label()).isEqualTo("abandoned");
        assertThat(old.done()).as("progress as last written").isEqualTo(40);
        assertThat(old.result()).isNull();
    }

    @Test
    void theNewestJobsAreKeptAndAnyStillRunning() {
        List<AgroalDataSource> pools = oneJournalTwice();
        Instant t0 = Instant.parse("2026-03-02T09:00:00Z");
        MutableClock clock = new MutableClock(t0);
        WhatIfRows rows = new WhatIfRows(pools.get(0), clock);
        // the oldest job still runs on a live instance (its heartbeat is fresh); the 35 after it have ended
        rows.accepted("running", "journal", t0, 10);
        for (int i = 0; i < WhatIfJobs.KEEP + 3; i++) {
            rows.accepted("ended-" + i, "journal", t0.plusSeconds(1 + i), 10);
            rows.ended("ended-" + i, "done", 10, 10, t0, t0.plusSeconds(1 + i), null, null);
        }
        clock.advance(Duration.ofMinutes(1));
        rows.beat("running", 5, 10, t0);

        assertThat(rows.forgetBeyond(WhatIfJobs.KEEP, clock.instant().minus(WhatIfJobs.ABANDONED_AFTER)))
                .as("ended jobs older than the newest %d", WhatIfJobs.KEEP).isEqualTo(3);
        assertThat(rows.find("running")).as("a running job is kept however old").isPresent();
        assertThat(rows.find("ended-0")).isEmpty();
        assertThat(rows.find("ended-2")).isEmpty();
        assertThat(rows.find("ended-3")).isPresent();
        assertThat(rows.find("ended-" + (WhatIfJobs.KEEP + 2))).isPresent();
    }
}
