package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

/**
 * Checkpoints are read back a few at a time, so that a start on many curves holds only a few of
 * their images at once: every one comes back, once, in curve order, whether all are asked for or
 * some by name, across many pages.
 */
class CurveCheckpointsTest {

    @Test
    void everyCheckpointComesBackOnceAcrossPagesAllOrByName() {
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:mem:checkpoints-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2)) {
            CurveCheckpoints checkpoints = new CurveCheckpoints(ds, Clock.systemUTC());
            // 53 curves: three full pages of 16 and a part; names whose order as text differs from their numbers
            List<CurveCheckpoints.Stored> written = IntStream.rangeClosed(1, 53)
                    .mapToObj(i -> new CurveCheckpoints.Stored("GOVT-" + i, i * 10L, "fingerprint", 1, new byte[] {(byte) i, 7}))
                    .toList();
            checkpoints.write(written);

            List<String> all = new ArrayList<>();
            List<String> order = new ArrayList<>();
            checkpoints.each(null, s -> {
                all.add(s.curve() + "@" + s.seq() + ":" + s.image()[0]);
                order.add(s.curve());
            });
            assertThat(order).as("curves in the database's order of names, as the pages are cut").isSorted();
            assertThat(all).hasSize(53).doesNotHaveDuplicates()
                    .containsExactlyInAnyOrderElementsOf(written.stream().map(s -> s.curve() + "@" + s.seq() + ":" + s.image()[0]).toList());

            List<String> named = IntStream.rangeClosed(1, 40).filter(i -> i % 2 == 0).mapToObj(i -> "GOVT-" + i).toList();
            List<String> some = new ArrayList<>();
            checkpoints.each(java.util.Set.copyOf(named), s -> some.add(s.curve()));
            assertThat(some).containsExactlyInAnyOrderElementsOf(named);

            List<String> none = new ArrayList<>();
            checkpoints.each(List.of("GOVT-999"), s -> none.add(s.curve()));
            assertThat(none).isEmpty();
        }
    }
}
