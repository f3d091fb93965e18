package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.MutableClock;

/**
 * The policy each instance runs and the reloads accepted, the same checks on H2 and PostgreSQL:
 * {@code since} moves only when the content changes, the heartbeat always; the newest accepted
 * reload is the one written last; the list pages in the order instances first appeared.
 */
abstract class PolicyInForceChecks extends AlertJournalFixture {

    @Test
    void sinceMovesWithTheContentAndLastSeenWithEveryHeartbeat() {
        MutableClock time = new MutableClock(T0);
        PolicyInForce store = new PolicyInForce(database(), time);

        store.seen("desk-a-1", "h1", "alert-rules/default.yaml", null);
        time.advance(Duration.ofSeconds(5));
        store.seen("desk-a-1", "h1", "alert-rules/default.yaml", "h2");
        assertThat(store.seenSince(T0)).singleElement().satisfies(i -> {
            assertThat(i.since()).as("the same content: since stays").isEqualTo(T0);
            assertThat(i.lastSeen()).isEqualTo(T0.plusSeconds(5));
            assertThat(i.waitingFor()).isEqualTo("h2");
        });
        time.advance(Duration.ofSeconds(5));
        store.seen("desk-a-1", "h2", "alert-rules/default.yaml", null);
        assertThat(store.seenSince(T0)).singleElement().satisfies(i -> {
            assertThat(i.hash()).isEqualTo("h2");
            assertThat(i.since()).as("new content: since moves").isEqualTo(T0.plusSeconds(10));
            assertThat(i.waitingFor()).isNull();
        });
        assertThat(store.seenSince(T0.plusSeconds(11))).as("not seen since").isEmpty();
    }

    @Test
    void theNewestReloadIsTheOneAcceptedLast() {
        PolicyInForce store = new PolicyInForce(database(), clock);

        assertThat(store.newestReload()).isEmpty();
        store.accepted("h1", "desk-a-1");
        store.accepted("h2", "desk-b-7");
        assertThat(store.newestReload()).get().satisfies(r -> {
            assertThat(r.hash()).isEqualTo("h2");
            assertThat(r.instance()).isEqualTo("desk-b-7");
            assertThat(r.acceptedAt()).isEqualTo(T0);
        });
    }

    @Test
    void instancesPageInTheOrderTheyFirstAppeared() {
        PolicyInForce store = new PolicyInForce(database(), clock);
        for (String id : new String[] {"z", "a", "m"}) {
            store.seen(id, "h1", "p.yaml", null);
        }
        store.seen("z", "h2", "p.yaml", null); // a heartbeat does not move an instance in the list

        java.util.List<PolicyInForce.Instance> first = store.page(2, null);
        assertThat(first).extracting(PolicyInForce.Instance::instance).containsExactly("z", "a");
        assertThat(store.page(2, first.get(1).id())).extracting(PolicyInForce.Instance::instance).containsExactly("m");
        assertThat(store.seenSince(Instant.EPOCH)).extracting(PolicyInForce.Instance::instance).containsExactly("a", "m", "z");
    }
}
