package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Severity;
import org.slopewatch.testsupport.PostgresServer;

/**
 * What the checks of the alert stores share: a fresh journal per test on H2 or PostgreSQL (the
 * subclass says which), a fixed clock, and a hand-written notice of a confirmed inversion with two
 * outbox rows, one pending and one skipped.
 */
abstract class AlertJournalFixture {

    static final Instant T0 = Instant.parse("2026-09-30T21:00:00Z");
    static final String ID = "inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~1";

    private final List<AutoCloseable> open = new ArrayList<>();
    final Clock clock = Clock.fixed(T0, ZoneOffset.UTC);

    /** A new, empty, migrated journal. */
    protected abstract AgroalDataSource database();

    protected final <T extends AutoCloseable> T closeAfterTest(T resource) {
        open.add(resource);
        return resource;
    }

    /** An H2 file database in {@code dir}. */
    protected final AgroalDataSource h2(Path dir) {
        return closeAfterTest(JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=0", "sa", "", 4));
    }

    /** A fresh database on the test PostgreSQL server, dropped after the test. */
    protected final AgroalDataSource postgres() {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4));
    }

    @AfterEach
    void close() throws Exception {
        Collections.reverse(open);
        for (AutoCloseable c : open) {
            c.close();
        }
        open.clear();
    }

    static JournalEntries notice(String id, int notice, Alert.Kind kind) {
        return notice(id, notice, kind, null);
    }

    static JournalEntries notice(String id, int notice, Alert.Kind kind, String mutedBy) {
        Alert alert = new Alert(id, "inversion-confirmed", Severity.CRITICAL, kind, "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30),
                "CONFIRMED", "[CRITICAL] GOVT-A 10Y-3M CONFIRMED", "confirmed\n\n" + Alert.CAUTION,
                List.of(new Alert.Fact("days inverted", "92"), new Alert.Fact("tab\there", "line\nbreak")), "http://localhost:8080/", T0);
        JournalEntries e = new JournalEntries();
        e.alert(new JournalEntries.AlertEntry(alert, "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30), notice, mutedBy, "abc123", 42L,
                List.of(new JournalEntries.Outbox("log", null), new JournalEntries.Outbox("desk-chat", "channel desk-chat is not configured"))));
        return e;
    }
}
