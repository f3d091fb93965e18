package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.curve.Tenor;

/**
 * The embedded journal's commits are on disk when the call that made them returns, whatever URL
 * the operator gave. What H2 does otherwise, from its source (H2 2.4.240, the version the build
 * uses): {@code WRITE_DELAY} defaults to 500 ms ({@code Constants.DEFAULT_WRITE_DELAY}), during
 * which a committed transaction lives in memory only and a background thread writes it later;
 * with 0 a commit writes its chunk before returning ({@code TransactionStore.endTransaction}), and
 * only {@code CHECKPOINT SYNC} calls {@code FileChannel.force} ({@code SingleFileStore.sync}).
 */
class JournalDurabilityTest {

    private final Clock clock = Clock.fixed(Instant.parse("2026-03-02T12:00:00Z"), ZoneOffset.UTC);

    @TempDir
    Path dir;

    @Test
    void anH2JournalCommitsWithoutDelayWhateverTheUrlLeftOut() throws SQLException {
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_ON_EXIT=FALSE", "", "", 2)) {
            assertThat(setting(ds, "WRITE_DELAY")).as("H2's WRITE_DELAY on the opened journal (H2's own default: 500 ms)").isEqualTo("0");
        }
    }

    @Test
    void anH2UrlThatDelaysCommitsIsRefusedNamingTheSetting() {
        for (String delay : new String[] {"WRITE_DELAY=500", "write_delay = 10"}) {
            assertThatThrownBy(() -> JournalDatabase.open("jdbc:h2:file:" + dir.resolve("delayed") + ";" + delay, "", "", 2))
                    .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("WRITE_DELAY").hasMessageContaining("set it to 0");
        }
    }

    @Test
    void anH2UrlThatAsksForNoDelayIsTakenAsItIs() throws SQLException {
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:file:" + dir.resolve("prompt") + ";write_delay=0", "", "", 2)) {
            assertThat(setting(ds, "WRITE_DELAY")).isEqualTo("0");
        }
    }

    /**
     * Each write returns only after the database file was forced to disk, with nothing written
     * before it left unforced: a step's quotes, and a policy version (as every alert store writes, through {@link JournalSql}).
     */
    @Test
    void everyCommitIsForcedToDiskBeforeTheWriteReturns() {
        Path file = dir.resolve("forced");
        ForceCountingFilePath.Counts counts = ForceCountingFilePath.of(file);
        try (AgroalDataSource ds = JournalDatabase.open(ForceCountingFilePath.url(file), "", "", 2)) {
            JournalWriter writer = new JournalWriter(ds, clock);
            PolicyVersions policies = new PolicyVersions(ds, clock);
            for (int i = 1; i <= 3; i++) {
                long forces = counts.forces.get();
                long writes = counts.writes.get();
                JournalEntries step = new JournalEntries();
                step.quote(new JournalEntries.AcceptedQuote(i, "test", "q-" + i, null, null, "GOVT-A", LocalDate.of(2026, 3, i + 1),
                        new TreeMap<>(Map.of(Tenor.months(3), 410.0, Tenor.years(10), 400.0 + i))));
                writer.write(step);
                assertThat(counts.writes.get()).as("step %d written to the file", i).isGreaterThan(writes);
                assertThat(counts.forces.get()).as("step %d forced to disk", i).isGreaterThan(forces);
                assertThat(counts.unforced()).as("writes of step %d not forced when the write returned", i).isZero();
            }
            long forces = counts.forces.get();
            policies.policyVersion("hash", "policy.yaml", "applied", null);
            assertThat(counts.forces.get()).as("an alert store transaction forced to disk").isGreaterThan(forces);
            assertThat(counts.unforced()).as("writes of the alert store transaction not forced").isZero();
        }
    }

    private static String setting(AgroalDataSource ds, String name) throws SQLException {
        try (Connection c = ds.getConnection(); Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("SELECT SETTING_VALUE FROM INFORMATION_SCHEMA.SETTINGS WHERE SETTING_NAME = '" + name + "'")) {
            return rs.next() ? rs.getString(1) : null;
        }
    }
}
