package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/**
 * The outbox, the same checks on H2 and PostgreSQL: a notice is stored once by id whatever writes
 * it again, its outbox survives a restart (a new store and writer find the pending delivery),
 * attempts move a delivery through its states, and one instance at a time holds a claim. Source of
 * the expectations: the delivery rules of the alerting design (an id is never stored twice; a
 * pending delivery is due at its next attempt time) applied to hand-written rows.
 */
abstract class DeliveryOutboxChecks extends AlertJournalFixture {

    @Test
    void aNoticeIsStoredOnceAndItsOutboxSurvivesARestart() {
        AgroalDataSource ds = database();
        String id = ID;
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.OPENING));
        // a restart, or a second instance deciding the same notice: new objects, same journal
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.OPENING));
        DeliveryOutbox store = new DeliveryOutbox(ds, clock);
        AlertHistory history = new AlertHistory(ds);

        assertThat(new NewestAlerts(ds).page(10, null, null)).hasSize(1);
        assertThat(store.backlog()).isEqualTo(1);
        List<DeliveryOutbox.Due> due = store.due("log", T0, 10);
        assertThat(due).singleElement().satisfies(d -> {
            assertThat(d.alert().id()).isEqualTo(id);
            assertThat(d.alert().text()).endsWith(Alert.CAUTION);
            assertThat(d.alert().facts()).containsExactly(new Alert.Fact("days inverted", "92"), new Alert.Fact("tab here", "line break"));
            assertThat(d.delivery().attempts()).isZero();
        });
        assertThat(store.due("desk-chat", T0, 10)).as("a skipped delivery is never due").isEmpty();
        assertThat(history.find(id).deliveries()).extracting(DeliveryOutbox.Delivery::status)
                .containsExactlyInAnyOrder(DeliveryOutbox.Status.PENDING, DeliveryOutbox.Status.SKIPPED);
    }

    @Test
    void attemptsMoveADeliveryFromPendingToDelivered() {
        AgroalDataSource ds = database();
        String id = ID;
        new JournalWriter(ds, clock).write(notice(id, 1, Alert.Kind.OPENING));
        DeliveryOutbox store = new DeliveryOutbox(ds, clock);
        DeliveryOutbox.Delivery first = store.due("log", T0, 10).get(0).delivery();

        Instant retryAt = T0.plusSeconds(30);
        store.attempt(first, T0, "retry", "HTTP 503", "retry in 30s", DeliveryOutbox.Status.PENDING, retryAt);
        assertThat(store.due("log", T0.plusSeconds(29), 10)).as("not before its retry time").isEmpty();
        DeliveryOutbox.Delivery second = store.due("log", retryAt, 10).get(0).delivery();
        assertThat(second.attempts()).isEqualTo(1);
        assertThat(second.firstAttemptAt()).isEqualTo(T0);

        store.attempt(second, retryAt, "delivered", "HTTP 200", "delivered on attempt 2", DeliveryOutbox.Status.DELIVERED, null);
        assertThat(store.due("log", retryAt.plus(Duration.ofDays(1)), 10)).isEmpty();
        assertThat(store.backlog()).isZero();
        DeliveryOutbox.Delivery done = new AlertHistory(ds).find(id).deliveries().stream().filter(d -> d.channel().equals("log"))
                .findFirst().orElseThrow();
        assertThat(done.status()).isEqualTo(DeliveryOutbox.Status.DELIVERED);
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
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.OPENING));
        DeliveryOutbox first = new DeliveryOutbox(ds, clock);
        DeliveryOutbox second = new DeliveryOutbox(ds, clock);
        DeliveryOutbox.Delivery seenByBoth = first.due("log", T0, 10).get(0).delivery();

        assertThat(first.claim(seenByBoth, "instance-1", T0, T0.plusSeconds(120))).isTrue();
        assertThat(second.claim(seenByBoth, "instance-2", T0.plusSeconds(1), T0.plusSeconds(121))).as("held by instance-1").isFalse();
        assertThat(second.claim(seenByBoth, "instance-2", T0.plusSeconds(121), T0.plusSeconds(241)))
                .as("instance-1's lease ran out (it died mid-attempt)").isTrue();

        second.attempt(seenByBoth, T0.plusSeconds(121), "retry", "HTTP 503", "retry in 30s", DeliveryOutbox.Status.PENDING,
                T0.plusSeconds(151));
        assertThat(first.claim(seenByBoth, "instance-1", T0.plusSeconds(200), T0.plusSeconds(320)))
                .as("read before instance-2's attempt was recorded: stale").isFalse();
        DeliveryOutbox.Delivery fresh = first.due("log", T0.plusSeconds(200), 10).get(0).delivery();
        assertThat(first.claim(fresh, "instance-1", T0.plusSeconds(200), T0.plusSeconds(320))).as("recording the attempt freed it").isTrue();
    }
}
