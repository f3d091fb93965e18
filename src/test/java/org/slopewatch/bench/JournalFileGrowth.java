package org.slopewatch.bench;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.util.Locale;
import java.util.TreeMap;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.monitor.Observation;
import org.slopewatch.spread.SpreadKey;

/**
 * How the embedded journal's file grows with small steps, and what each durable commit costs:
 * steps of {@code messages} snapshot messages (11 tenors, three spread values each, as the default
 * policy journals them) written one after the other through {@link JournalWriter} into a fresh H2
 * file, once per compaction interval given. Prints the file's size every {@code report} commits
 * and the time per commit; {@code per-second} paces the commits (0: as fast as they go). Not a test;
 * run by hand:
 *
 * <pre>
 * java -cp target/test-classes:target/classes:$(cat bench/out/test-classpath.txt) \
 *   org.slopewatch.bench.JournalFileGrowth COMMITS MESSAGES REPORT PER_SECOND COMPACT_EVERY...
 * </pre>
 */
public final class JournalFileGrowth {

    private static final String[] TENORS = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};
    private static final String[] SPREADS = {"10Y-3M", "10Y-2Y", "NTFS"};

    public static void main(String[] args) throws Exception {
        int commits = Integer.parseInt(args[0]);
        int messages = Integer.parseInt(args[1]);
        int report = Integer.parseInt(args[2]);
        double perSecond = Double.parseDouble(args[3]);
        for (int a = 4; a < args.length; a++) {
            int compactEvery = Integer.parseInt(args[a]);
            Path dir = Files.createTempDirectory("slopewatch-growth-");
            Path file = dir.resolve("journal.mv.db");
            JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal"), "", "", 2).close();
            // -1: H2's default write delay, its background writer compacting (a comparison: not durable)
            javax.sql.DataSource raw = null;
            if (compactEvery < 0) {
                org.h2.jdbcx.JdbcDataSource h2 = new org.h2.jdbcx.JdbcDataSource();
                h2.setURL("jdbc:h2:file:" + dir.resolve("journal"));
                h2.setUser("");
                raw = h2;
            }
            try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=-1", "", "", 2)) {
                JournalWriter writer = new JournalWriter(raw != null ? raw : ds, Clock.systemUTC(), Math.max(0, compactEvery));
                if (raw != null) {
                    try (java.sql.Connection c = raw.getConnection(); java.sql.Statement st = c.createStatement()) {
                        st.execute("SET WRITE_DELAY 500");
                    }
                }
                long seq = 0;
                LocalDate date = LocalDate.of(1990, 1, 1);
                long started = System.nanoTime();
                for (int i = 1; i <= commits; i++) {
                    if (perSecond > 0) {
                        long due = started + (long) ((i - 1) * 1e9 / perSecond);
                        long wait = due - System.nanoTime();
                        if (wait > 0) {
                            Thread.sleep(wait / 1_000_000, (int) (wait % 1_000_000));
                        }
                    }
                    JournalEntries step = new JournalEntries();
                    for (int m = 0; m < messages; m++) {
                        seq++;
                        date = date.plusDays(1);
                        TreeMap<Tenor, Double> yields = new TreeMap<>();
                        for (int t = 0; t < TENORS.length; t++) {
                            yields.put(Tenor.parse(TENORS[t]), 400.0 + t + (seq % 17));
                        }
                        step.quote(new JournalEntries.AcceptedQuote(seq, "bench", "g-" + seq, null, null, "GOVT-A", date, yields));
                        for (String spread : SPREADS) {
                            step.observation(new SpreadKey("GOVT-A", spread), new Observation(date, -5.0 + (seq % 11), seq));
                        }
                    }
                    writer.write(step);
                    if (i % report == 0 || i == commits) {
                        double seconds = (System.nanoTime() - started) / 1e9;
                        String fill;
                        try (java.sql.Connection c = ds.getConnection()) {
                            org.h2.mvstore.MVStore st = ((org.h2.engine.SessionLocal) c.unwrap(org.h2.jdbc.JdbcConnection.class).getSession())
                                    .getDatabase().getStore().getMvStore();
                            fill = "fill=" + st.getFillRate() + " chunks_fill=" + st.getFileStore().getChunksFillRate() + " delay=" + st.getAutoCommitDelay();
                        }
                        System.out.printf(Locale.ROOT, "compact_every=%d commits=%d messages=%d file_kb=%d ms_per_commit=%.2f %s%n", compactEvery,
                                i, seq, Files.size(file) / 1024, seconds * 1000 / i, fill);
                    }
                }
            } finally {
                try (var files = Files.list(dir)) {
                    for (Path p : (Iterable<Path>) files::iterator) {
                        Files.delete(p);
                    }
                }
                Files.delete(dir);
            }
        }
    }

    private JournalFileGrowth() {
    }
}
