package org.slopewatch.bench;

import io.agroal.api.AgroalDataSource;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.Statement;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SortedMap;
import java.util.stream.Collectors;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.SeriesMap;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.monitor.Watch;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.spread.SpreadKey;

/**
 * The baseline of {@code bench/ingest-vs-jdbc.sh}: the rows a snapshot costs the journal, written
 * by plain JDBC and nothing else. For every snapshot of a history file, one quote row and one
 * value row per spread the policy watches on its curve, into a journal of the project's schema
 * (migrated as the daemon migrates it, so the same tables and indexes), as batched
 * {@code INSERT}s committed every 5,000 snapshots, each commit made durable as the daemon's are
 * ({@code CHECKPOINT SYNC} on H2). Nothing is computed: a spread's value is a stand-in (the
 * snapshot's longest tenor minus its shortest). Timed from the first row to the last commit.
 *
 * <p>Usage: {@code BareJournalWriter FILE POLICY JDBC-URL USER PASSWORD}
 */
public final class BareJournalWriter {

    private static final int SNAPSHOTS_PER_COMMIT = 5_000;

    private BareJournalWriter() {
    }

    public static void main(String[] args) throws Exception {
        Path file = Path.of(args[0]);
        List<Watch> watches = PolicyParser.parse(args[1], Files.readAllBytes(Path.of(args[1]))).watches();
        List<CurveSnapshot> snapshots = new ArrayList<>();
        String curve = file.getFileName().toString().replaceFirst("\\.[^.]*$", "");
        try (InputStream in = Files.newInputStream(file)) {
            HistoryCsvReader.read(file.toString(), in, new HistoryCsvReader.Options(curve, YieldUnit.parse("percent"), YieldBounds.DEFAULT,
                    SeriesMap.readOrNone(null)), snapshots::add, () -> { });
        }
        try (AgroalDataSource ds = JournalDatabase.open(args[2], args[3], args[4], 2)) {
            long started = System.nanoTime();
            long rows = write(ds, watches, snapshots, args[2].startsWith("jdbc:h2:"));
            double seconds = (System.nanoTime() - started) / 1e9;
            System.out.println(String.format(Locale.ROOT, "bare-jdbc: %d snapshots, %d rows, %.2f s, %.0f snapshots/s", snapshots.size(),
                    rows, seconds, snapshots.size() / seconds));
        }
    }

    private static long write(AgroalDataSource ds, List<Watch> watches, List<CurveSnapshot> snapshots, boolean h2) throws Exception {
        Map<String, List<String>> spreadIds = snapshots.stream().map(CurveSnapshot::curve).distinct().collect(Collectors.toMap(c -> c,
                c -> watches.stream().filter(w -> w.appliesTo(c)).map(w -> new SpreadKey(c, w.spread().name()).id()).toList()));
        long rows = 0;
        try (Connection c = ds.getConnection();
             PreparedStatement quote = c.prepareStatement("INSERT INTO quote (seq, message_id, origin, source, sent_at, curve, market_date, "
                     + "yields, recorded_at) VALUES (?,?,?,?,?,?,?,?,?)");
             PreparedStatement value = c.prepareStatement("INSERT INTO observation (spread_id, market_date, value_bp, seq, recorded_at) "
                     + "VALUES (?,?,?,?,?)");
             Statement sync = c.createStatement()) {
            c.setAutoCommit(false);
            long seq = 0;
            for (CurveSnapshot s : snapshots) {
                Timestamp now = Timestamp.from(Instant.now());
                Date date = Date.valueOf(s.date());
                SortedMap<Tenor, Double> yields = s.asMap();
                quote.setLong(1, ++seq);
                quote.setString(2, null);
                quote.setString(3, "http");
                quote.setString(4, null);
                quote.setTimestamp(5, null);
                quote.setString(6, s.curve());
                quote.setDate(7, date);
                quote.setString(8, yields.entrySet().stream().map(e -> e.getKey() + "=" + e.getValue()).collect(Collectors.joining(";")));
                quote.setTimestamp(9, now);
                quote.addBatch();
                rows++;
                double standIn = yields.get(yields.lastKey()) - yields.get(yields.firstKey());
                for (String id : spreadIds.get(s.curve())) {
                    value.setString(1, id);
                    value.setDate(2, date);
                    value.setDouble(3, standIn);
                    value.setLong(4, seq);
                    value.setTimestamp(5, now);
                    value.addBatch();
                    rows++;
                }
                if (seq % SNAPSHOTS_PER_COMMIT == 0 || seq == snapshots.size()) {
                    quote.executeBatch();
                    value.executeBatch();
                    c.commit();
                    if (h2) {
                        sync.execute("CHECKPOINT SYNC");
                    }
                }
            }
        }
        return rows;
    }
}
