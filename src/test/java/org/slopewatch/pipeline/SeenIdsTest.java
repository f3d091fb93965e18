package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Collection;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * The bounded memory of seen ids in front of the journal. The journal here is a plain set of the
 * ids committed so far; the reference for every answer is the JDK's {@code HashSet} of every id
 * ever taken, which is what de-duplication must equal.
 */
class SeenIdsTest {

    /** A journal of taken ids that counts the lookups asked of it and the ids in them. */
    private static final class CountingJournal {
        final Set<String> stored = new HashSet<>();
        final List<Collection<String>> lookups = new ArrayList<>();

        Set<String> seenAmong(Collection<String> ids) {
            lookups.add(List.copyOf(ids));
            Set<String> found = new HashSet<>(ids);
            found.retainAll(stored);
            return found;
        }
    }

    @Test
    void memoryNeverHoldsMoreThanItsCapacity() {
        CountingJournal journal = new CountingJournal();
        SeenIds seen = new SeenIds(100, journal::seenAmong);
        for (int i = 0; i < 100_000; i++) {
            String id = "m" + i;
            seen.takenBefore(List.of(id));
            journal.stored.add(id);
            seen.remember(List.of(id));
            assertThat(seen.size()).isLessThanOrEqualTo(100);
        }
        assertThat(seen.size()).isEqualTo(100);
        assertThat(seen.takenBefore(List.of("m99999", "m0"))).as("a recent id and one long gone").containsExactlyInAnyOrder("m99999", "m0");
    }

    @Test
    void onlyWhatMemoryDoesNotKnowIsAskedOfTheJournalInOneLookup() {
        CountingJournal journal = new CountingJournal();
        SeenIds seen = new SeenIds(3, journal::seenAmong);
        journal.stored.addAll(List.of("a", "b", "c", "d"));
        seen.remember(List.of("b", "c", "d")); // "a" was let go

        Set<String> taken = seen.takenBefore(List.of("a", "c", "new-1", "new-2"));

        assertThat(taken).containsExactlyInAnyOrder("a", "c");
        assertThat(journal.lookups).as("one lookup for the step").hasSize(1);
        assertThat(journal.lookups.get(0)).as("of the ids memory does not hold").containsExactlyInAnyOrder("a", "new-1", "new-2");
        journal.lookups.clear();
        assertThat(seen.takenBefore(List.of("a"))).as("an id the journal answered for is held again").containsExactly("a");
        assertThat(journal.lookups).isEmpty();
    }

    @Test
    void aHitKeepsAnIdAndTheLeastRecentlyUsedGoesFirst() {
        CountingJournal journal = new CountingJournal();
        SeenIds seen = new SeenIds(2, journal::seenAmong);
        seen.remember(List.of("x", "y"));
        seen.takenBefore(List.of("x")); // x used again: y is now the oldest
        seen.remember(List.of("z"));
        journal.lookups.clear();

        assertThat(seen.takenBefore(List.of("x", "z"))).containsExactlyInAnyOrder("x", "z");
        assertThat(journal.lookups).as("x and z both still in memory").isEmpty();
        seen.takenBefore(List.of("y"));
        assertThat(journal.lookups).as("y was let go").containsExactly(List.of("y"));
    }

    @Test
    void answersEqualAnUnboundedSetOfEveryIdOnRandomTraffic() {
        Random random = new Random(42);
        CountingJournal journal = new CountingJournal();
        SeenIds seen = new SeenIds(16, journal::seenAmong);
        Set<String> reference = new HashSet<>();
        for (int step = 0; step < 2_000; step++) {
            List<String> ids = new ArrayList<>();
            for (int k = random.nextInt(5); k >= 0; k--) {
                ids.add("id" + random.nextInt(500)); // ids repeat, some soon, some hundreds of steps later
            }
            Set<String> expected = new HashSet<>(ids);
            expected.retainAll(reference);
            assertThat(seen.takenBefore(ids)).as("step %d", step).isEqualTo(expected);
            reference.addAll(ids);
            journal.stored.addAll(ids);
            seen.remember(ids);
        }
        assertThat(seen.size()).isEqualTo(16);
    }

    @Test
    void aCapacityBelowOneIsRefused() {
        assertThatThrownBy(() -> new SeenIds(0, ids -> Set.of())).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("at least one id");
    }
}
