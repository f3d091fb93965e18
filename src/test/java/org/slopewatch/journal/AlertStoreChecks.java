package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Severity;

/**
 * The alert tables of the journal, the same checks on H2 and PostgreSQL: a notice is stored once
 * by id whatever writes it again, its outbox survives a restart (a new store and writer find
 * the pending delivery), attempts move a delivery through its states, and acknowledgements,
 * mutes and policy versions read back as written. Source of the expectations: the delivery
 * rules of the alerting design (an id is never stored twice; a pending delivery is due at its
 * next attempt time) applied to hand-written rows.
 */
abstract class AlertStoreChecks {

    private static final Instant T0 = Instant.parse("2026-09-30T21:00:00Z");
    private final List<AutoCloseable> open = new ArrayList<>();
    private final Clock clock = Clock.fixed(T0, ZoneOffset.UTC);

    /** A new, empty, migrated journal. */
    protected abstract AgroalDataSource database();

    protected final <T extends AutoCloseable> T closeAfterTest(T resource) {
        open.add(resource);
        return resource;
    }

    @AfterEach
    void close() throws Exception {
        Collections.reverse(open);
        for (AutoCloseable c : open) {
            c.close();
        }
        open.clear();
    }

    private static JournalEntries notice(String id, int notice, Alert.Kind kind) {
        return notice(id, notice, kind, null);
    }

    private static JournalEntries notice(String id, int notice, Alert.Kind kind, String mutedBy) {
        Alert alert = new Alert(id, "inversion-confirmed", Severity.CRITICAL, kind, "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30),
                "CONFIRMED", "[CRITICAL] GOVT-A 10Y-3M CONFIRMED", "confirmed\n\n" + Alert.CAUTION,
                List.of(new Alert.Fact("days inverted", "92"), new Alert.Fact("tab\there", "line\nbreak")), "http://localhost:8080/", T0);
        JournalEntries e = new JournalEntries();
        e.alert(new JournalEntries.AlertEntry(alert, "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30), notice, mutedBy, "abc123", 42L,
                List.of(new JournalEntries.Outbox("log", null), new JournalEntries.Outbox("desk-chat", "channel desk-chat is not configured"))));
        return e;
    }

    @Test
    void aNoticeIsStoredOnceAndItsOutboxSurvivesARestart() {
        AgroalDataSource ds = database();
        String id = "inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1";
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.FIRING));
        // a restart, or a second instance deciding the same notice: new objects, same journal
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.FIRING));
        AlertStore store = new AlertStore(ds, clock);

        assertThat(store.recent(10)).hasSize(1);
        assertThat(store.backlog()).isEqualTo(1);
        List<AlertStore.Due> due = store.due("log", T0, 10);
        assertThat(due).singleElement().satisfies(d -> {
            assertThat(d.alert().id()).isEqualTo(id);
            assertThat(d.alert().text()).endsWith(Alert.CAUTION);
            assertThat(d.alert().facts()).containsExactly(new Alert.Fact("days inverted", "92"), new Alert.Fact("tab here", "line break"));
            assertThat(d.delivery().attempts()).isZero();
        });
        assertThat(store.due("desk-chat", T0, 10)).as("a skipped delivery is never due").isEmpty();
        assertThat(store.find(id).deliveries()).extracting(AlertStore.Delivery::status)
                .containsExactlyInAnyOrder(AlertStore.Status.PENDING, AlertStore.Status.SKIPPED);
    }

    @Test
    void attemptsMoveADeliveryFromPendingToDelivered() {
        AgroalDataSource ds = database();
        String id = "inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1";
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.FIRING));
        AlertStore store = new AlertStore(ds, clock);
        AlertStore.Delivery first = store.due("log", T0, 10).get(0).delivery();

        Instant retryAt = T0.plusSeconds(30);
        store.attempt(first, T0, "retry", "HTTP 503", "retry in 30s", AlertStore.Status.PENDING, retryAt);
        assertThat(store.due("log", T0.plusSeconds(29), 10)).as("not before its retry time").isEmpty();
        AlertStore.Delivery second = store.due("log", retryAt, 10).get(0).delivery();
        assertThat(second.attempts()).isEqualTo(1);
        assertThat(second.firstAttemptAt()).isEqualTo(T0);

        store.attempt(second, retryAt, "delivered", "HTTP 200", "delivered on attempt 2", AlertStore.Status.DELIVERED, null);
        assertThat(store.due("log", retryAt.plus(Duration.ofDays(1)), 10)).isEmpty();
        assertThat(store.backlog()).isZero();
        AlertStore.Delivery done = store.find(id).deliveries().stream().filter(d -> d.channel().equals("log")).findFirst().orElseThrow();
        assertThat(done.status()).isEqualTo(AlertStore.Status.DELIVERED);
        assertThat(done.attempts()).isEqualTo(2);
        assertThat(done.firstAttemptAt()).as("kept from the first attempt").isEqualTo(T0);
    }

    /*
     * Two daemons on one journal: whoever claims a due delivery first attempts it; the other
     * backs off until the claim's lease runs out, and a claim read before an attempt was recorded
     * is refused.
     */
    @Test
    void aDeliveryIsClaimedByOneInstanceAtATime() {
        AgroalDataSource ds = database();
        new JournalWriter(ds, clock).write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1", 1, Alert.Kind.FIRING));
        AlertStore first = new AlertStore(ds, clock);
        AlertStore second = new AlertStore(ds, clock);
        AlertStore.Delivery seenByBoth = first.due("log", T0, 10).get(0).delivery();

        assertThat(first.claim(seenByBoth, "instance-1", T0, T0.plusSeconds(120))).isTrue();
        assertThat(second.claim(seenByBoth, "instance-2", T0.plusSeconds(1), T0.plusSeconds(121))).as("held by instance-1").isFalse();
        assertThat(second.claim(seenByBoth, "instance-2", T0.plusSeconds(121), T0.plusSeconds(241)))
                .as("instance-1's lease ran out (it died mid-attempt)").isTrue();

        second.attempt(seenByBoth, T0.plusSeconds(121), "retry", "HTTP 503", "retry in 30s", AlertStore.Status.PENDING,
                T0.plusSeconds(151));
        assertThat(first.claim(seenByBoth, "instance-1", T0.plusSeconds(200), T0.plusSeconds(320)))
                .as("read before instance-2's attempt was recorded: stale").isFalse();
        AlertStore.Delivery fresh = first.due("log", T0.plusSeconds(200), 10).get(0).delivery();
        assertThat(first.claim(fresh, "instance-1", T0.plusSeconds(200), T0.plusSeconds(320))).as("recording the attempt freed it").isTrue();
    }

    @Test
    void aNoticeMutedByTheLongestMuteIsStored() {
        // The desk describes the mute that silenced a notice as "KIND TARGET muted by BY until UNTIL (REASON)"; with a
        // rule of 100 characters, by of 100 and a reason of 400 (what the mute table holds, V2__alerts.sql) that is
        // about 650 characters, and alert.muted_by holds 400: the write of the notice, and with it the whole
        // pipeline step, failed.
        AgroalDataSource ds = database();
        String id = "inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1";
        String mutedBy = "rule " + "r".repeat(100) + " muted by " + "b".repeat(100) + " until " + T0.plusSeconds(3600) + " ("
                + "x".repeat(400) + ")";
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.FIRING, mutedBy));
        String stored = new AlertStore(ds, clock).find(id).stored().mutedBy();
        assertThat(stored).hasSize(400).startsWith("rule " + "r".repeat(100) + " muted by ").endsWith("…");
    }

    @Test
    void episodesAcksMutesAndPolicyVersionsReadBack() {
        AgroalDataSource ds = database();
        new JournalWriter(ds, clock).write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1", 1, Alert.Kind.FIRING));
        new JournalWriter(ds, Clock.offset(clock, Duration.ofDays(1)))
                .write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~2", 2, Alert.Kind.REPEAT));
        AlertStore store = new AlertStore(ds, clock);

        assertThat(store.latestPerEpisode()).singleElement().satisfies(a -> {
            assertThat(a.notice()).isEqualTo(2);
            assertThat(a.episodeSince()).isEqualTo(LocalDate.of(2026, 9, 30));
            assertThat(a.policyHash()).isEqualTo("abc123");
        });
        assertThat(store.episodeAcknowledged("inversion-confirmed", "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30))).isFalse();
        store.ack("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1", "desk-lead", "seen");
        assertThat(store.episodeAcknowledged("inversion-confirmed", "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30))).isTrue();

        AlertStore.Mute m = store.mute("spread", "GOVT-B:10Y-2Y", T0.plusSeconds(3600), "vendor maintenance", "ops");
        assertThat(store.mutes()).singleElement().satisfies(x -> assertThat(x.activeAt(T0)).isTrue());
        assertThat(store.lift(m.id(), "ops")).isTrue();
        assertThat(store.lift(m.id(), "ops")).as("lifted once").isFalse();
        assertThat(store.mutes().get(0).activeAt(T0)).isFalse();

        assertThat(store.currentPolicyHash()).isNull();
        store.policyVersion("h1", "alert-rules/default.yaml", "applied", "loaded at start-up");
        store.policyVersion("h2", "alert-rules/default.yaml", "rejected", "p.yaml:3:1: unknown key");
        assertThat(store.currentPolicyHash()).as("a rejected version is not in force").isEqualTo("h1");
    }
}
