package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.PostgresServer;

/**
 * Rows written in bulk come back as they were given: on PostgreSQL through {@code COPY}'s text
 * format (PostgreSQL 15 documentation, COPY, "File Formats", "Text Format": backslash, tab, line
 * feed and carriage return escaped, {@code \N} for null), elsewhere through a batched insert. On
 * PostgreSQL each row is also written a second time by the driver's own parameter binding
 * ({@code PreparedStatement}), the reference the copied row must equal, column by column.
 */
class BulkRowsTest {

    private record Sample(String text, Long number, Double value, LocalDate day, Instant at) {
    }

    private static final List<Sample> SAMPLES = samples();

    @Test
    void onPostgresqlCopiedRowsEqualTheValuesAndTheDriversOwnInsert() throws SQLException {
        try (PostgresServer.TestDatabase db = PostgresServer.freshDatabase();
             AgroalDataSource ds = JournalDatabase.open(db.url(), db.user(), db.password(), 2)) {
            List<Sample> copied = writeAndRead(ds, true);
            List<Sample> bound = writeAndRead(ds, false);
            assertThat(copied).isEqualTo(SAMPLES);
            assertThat(copied).isEqualTo(bound);
        }
    }

    @Test
    void onH2BatchedRowsEqualTheValuesAndTheDriversOwnInsert() throws SQLException {
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:mem:bulk-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2)) {
            List<Sample> batched = writeAndRead(ds, true);
            // H2 keeps no negative zero in a DOUBLE PRECISION column (seen here through its own bound insert too)
            assertThat(batched).isEqualTo(SAMPLES.stream().map(x -> Double.valueOf(-0.0).equals(x.value())
                    ? new Sample(x.text(), x.number(), 0.0, x.day(), x.at()) : x).toList());
            assertThat(batched).isEqualTo(writeAndRead(ds, false));
        }
    }

    /** Writes every sample into a fresh table, in bulk or one bound statement each, and reads them back in order. */
    private static List<Sample> writeAndRead(AgroalDataSource ds, boolean bulk) throws SQLException {
        try (Connection c = ds.getConnection(); Statement s = c.createStatement()) {
            c.setAutoCommit(false);
            s.execute("DROP TABLE IF EXISTS bulk_check");
            s.execute("CREATE TABLE bulk_check (id INTEGER, s VARCHAR(200), n BIGINT, d DOUBLE PRECISION, market_day DATE, "
                    + "at_time TIMESTAMP WITH TIME ZONE)");
            if (bulk) {
                try (BulkRows rows = BulkRows.into(c, "bulk_check", "id", "s", "n", "d", "market_day", "at_time")) {
                    for (int i = 0; i < SAMPLES.size(); i++) {
                        Sample x = SAMPLES.get(i);
                        rows.row(i, x.text(), x.number(), x.value(), x.day(), x.at() == null ? null : Timestamp.from(x.at()));
                    }
                    rows.write();
                }
            } else {
                try (PreparedStatement p = c.prepareStatement("INSERT INTO bulk_check (id, s, n, d, market_day, at_time) VALUES (?,?,?,?,?,?)")) {
                    for (int i = 0; i < SAMPLES.size(); i++) {
                        Sample x = SAMPLES.get(i);
                        p.setInt(1, i);
                        p.setString(2, x.text());
                        p.setObject(3, x.number(), java.sql.Types.BIGINT);
                        p.setObject(4, x.value(), java.sql.Types.DOUBLE);
                        p.setObject(5, x.day(), java.sql.Types.DATE);
                        p.setTimestamp(6, x.at() == null ? null : Timestamp.from(x.at()));
                        p.executeUpdate();
                    }
                }
            }
            c.commit();
            List<Sample> read = new ArrayList<>();
            try (ResultSet rs = s.executeQuery("SELECT s, n, d, market_day, at_time FROM bulk_check ORDER BY id")) {
                while (rs.next()) {
                    OffsetDateTime at = rs.getObject(5, OffsetDateTime.class);
                    read.add(new Sample(rs.getString(1), rs.getObject(2, Long.class), rs.getObject(3, Double.class),
                            rs.getObject(4, LocalDate.class), at == null ? null : at.toInstant()));
                }
            }
            c.commit();
            return read;
        }
    }

    /** Texts COPY must escape or must not mistake for its own marks, and numbers and times at their edges. */
    private static List<Sample> samples() {
        List<String> texts = new ArrayList<>(List.of("GOVT-A:10Y-3M", "tab\there", "line\nbreak", "carriage\rreturn", "back\\slash",
                "\\N", "ends with a backslash\\", "\\.", "quotes ' and \"", "unicode € ✓ 𝄞", ""));
        texts.add(null);
        List<Double> values = new ArrayList<>(List.of(0.0, -0.0, 1e-300, Double.MIN_VALUE, 1.0E-5, -40.00000000000006, 93.80000000000001,
                Double.MAX_VALUE, -123456.789));
        values.add(null);
        List<Long> numbers = new ArrayList<>(List.of(0L, -1L, Long.MAX_VALUE, Long.MIN_VALUE, 42L));
        numbers.add(null);
        List<LocalDate> days = new ArrayList<>(List.of(LocalDate.of(1, 1, 1), LocalDate.of(9999, 12, 31), LocalDate.of(2024, 2, 29),
                LocalDate.of(1962, 1, 2)));
        days.add(null);
        // the journal's clock: PostgreSQL keeps microseconds, so the samples hold no finer digit
        List<Instant> times = new ArrayList<>(List.of(Instant.EPOCH, Instant.parse("2026-12-05T16:00:00.000001Z"),
                Instant.parse("1999-12-31T23:59:59.999999Z"), Instant.parse("2026-03-29T01:30:00Z")));
        times.add(null);
        List<Sample> all = new ArrayList<>();
        int n = Math.max(texts.size(), values.size());
        for (int i = 0; i < n; i++) {
            all.add(new Sample(texts.get(i % texts.size()), numbers.get(i % numbers.size()), values.get(i % values.size()),
                    days.get(i % days.size()), times.get(i % times.size())));
        }
        assertThat(all).allMatch(Objects::nonNull);
        return List.copyOf(all);
    }
}
