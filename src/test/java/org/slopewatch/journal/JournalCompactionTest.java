package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.curve.Tenor;
import org.slopewatch.monitor.Observation;
import org.slopewatch.spread.SpreadKey;

/**
 * With every commit forced to disk, H2 (2.4.240) writes each commit as a chunk of its own and
 * frees a chunk only when none of its pages is live; its background writer, which rewrites sparse
 * chunks, is off with {@code WRITE_DELAY=0}. The same small steps written with and without
 * {@link JournalCompaction} must leave a smaller file with it. H2 only rewrites and frees chunks
 * older than {@code RETENTION_TIME} (45 s by default, from H2's {@code MVStore} documentation), so the
 * test sets it to 0 to see in a second what a running daemon sees after a minute.
 */
class JournalCompactionTest {

    private final Clock clock = Clock.fixed(Instant.parse("2026-03-02T12:00:00Z"), ZoneOffset.UTC);

    @TempDir
    Path dir;

    @Test
    void compactionKeepsAFileOfSmallCommitsSmaller() throws IOException {
        long without = fileAfterSmallSteps("plain", 0);
        long with = fileAfterSmallSteps("compacted", 10);
        System.out.printf("journal file after 1,500 steps of 5 messages: %d KB without compaction, %d KB with%n", without / 1024,
                with / 1024);
        assertThat(with).as("file size with compaction every 10 commits, against %d bytes without", without).isLessThan(without * 3 / 4);
    }

    private long fileAfterSmallSteps(String name, int compactEvery) throws IOException {
        Path file = dir.resolve(name);
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:file:" + file + ";RETENTION_TIME=0;DB_CLOSE_DELAY=-1", "", "", 2)) {
            JournalWriter writer = new JournalWriter(ds, clock, compactEvery);
            long seq = 0;
            for (int step = 0; step < 1_500; step++) {
                JournalEntries e = new JournalEntries();
                for (int m = 0; m < 5; m++) {
                    seq++;
                    LocalDate date = LocalDate.of(1990, 1, 1).plusDays(seq);
                    TreeMap<Tenor, Double> yields = new TreeMap<>();
                    yields.put(Tenor.months(3), 410.0 + seq % 7);
                    yields.put(Tenor.years(10), 400.0 + seq % 5);
                    e.quote(new JournalEntries.AcceptedQuote(seq, "test", "c-" + seq, null, null, "GOVT-A", date, yields));
                    e.observation(new SpreadKey("GOVT-A", "10Y-3M"), new Observation(date, -10.0 + seq % 3, seq));
                }
                writer.write(e);
            }
            return Files.size(dir.resolve(name + ".mv.db"));
        }
    }
}
