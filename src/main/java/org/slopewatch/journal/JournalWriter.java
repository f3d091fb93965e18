package org.slopewatch.journal;

import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.sql.Types;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.stream.Collectors;
import javax.sql.DataSource;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpellRestatement;
import org.slopewatch.monitor.Transition;

/**
 * Writes {@link JournalEntries} in one transaction (quote and spread-value rows in bulk,
 * {@link BulkRows}; the rest in batched statements), and returns once the
 * transaction is on disk ({@link JournalDurability#commit}). Every row carries the time it was
 * recorded, read from the injected clock.
 */
public final class JournalWriter {

    /** Commits between two compactions of an embedded H2 journal's file ({@link JournalCompaction}). */
    public static final int COMPACT_EVERY = 50;
    /**
     * Quote and spread-value rows a step holds before they go to the writer thread ({@link StepWrite}):
     * a live quote's step never reaches it; a backlog's or a backfill's does within a few hundred messages.
     */
    public static final int WRITE_AHEAD_ROWS = 2_000;

    private final JournalSql sql;
    private final Clock clock;
    private final JournalCompaction compaction;
    private final int aheadRows;
    /** The thread that writes a large step while it is decided; ends when idle. */
    private final ThreadPoolExecutor writerThread = new ThreadPoolExecutor(1, 1, 30, TimeUnit.SECONDS, new LinkedBlockingQueue<>(), r -> {
        Thread t = new Thread(r, "slopewatch-journal-writer");
        t.setDaemon(true);
        return t;
    });

    public JournalWriter(DataSource dataSource, Clock clock) {
        this(dataSource, clock, COMPACT_EVERY);
    }

    /** @param compactEvery commits between two compactions of an embedded H2 journal's file; 0 never (for measurements) */
    public JournalWriter(DataSource dataSource, Clock clock, int compactEvery) {
        this(dataSource, clock, compactEvery, WRITE_AHEAD_ROWS);
    }

    /** @param aheadRows rows a step holds before they are written ahead on the writer thread (1: every step, for tests) */
    public JournalWriter(DataSource dataSource, Clock clock, int compactEvery, int aheadRows) {
        if (aheadRows < 1) {
            throw new IllegalArgumentException("rows written ahead: at least 1, not " + aheadRows);
        }
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
        this.compaction = new JournalCompaction(compactEvery);
        this.aheadRows = aheadRows;
        writerThread.allowCoreThreadTimeOut(true);
    }

    /** The journal's side of a step about to be decided: written ahead in parts once it is large ({@link StepWrite}). */
    public StepWrite begin() {
        return new StepWrite(this, writerThread, aheadRows, this::writeInParts);
    }

    /**
     * On the writer thread: one transaction taking the step's parts as they come, the rest last,
     * committed durably; rolled back when told to give up or when anything fails.
     */
    private Void writeInParts(BlockingQueue<StepWrite.Part> parts) {
        Timestamp now = Timestamp.from(Instant.now(clock));
        int[] quotes = new int[1];
        return sql.transaction(c -> {
            for (;;) {
                StepWrite.Part part;
                try {
                    part = parts.take();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new SQLException("interrupted while writing a step", e);
                }
                if (part instanceof StepWrite.Rows rows) {
                    quotes[0] += rows.entries().quotes.size();
                    quotes(c, rows.entries(), now);
                    observations(c, rows.entries(), now);
                } else if (part instanceof StepWrite.Rest rest) {
                    quotes[0] += rest.entries().quotes.size();
                    all(c, rest.entries(), now);
                    return null;
                } else {
                    throw new SQLException("the step was abandoned before it was written whole");
                }
            }
        }, compaction::afterCommit, () -> "a step of " + quotes[0] + " quotes written in parts");
    }

    public void write(JournalEntries e) {
        if (e.isEmpty()) {
            return;
        }
        Timestamp now = Timestamp.from(Instant.now(clock));
        sql.transaction(c -> {
            all(c, e, now);
            return null;
        }, compaction::afterCommit, () -> e.quotes.size() + " quotes, " + e.transitionCount + " transitions and " + e.alerts.size()
                + " alerts");
    }

    private static void all(Connection c, JournalEntries e, Timestamp now) throws SQLException {
        quotes(c, e, now);
        rejects(c, e, now);
        observations(c, e, now);
        conclusions(c, e.conclusions, now);
        AlertRows.insert(c, e.alerts, now);
    }

    private static void quotes(Connection c, JournalEntries e, Timestamp now) throws SQLException {
        if (e.quotes.isEmpty()) {
            return;
        }
        try (BulkRows q = BulkRows.into(c, "quote", "seq", "message_id", "origin", "source", "sent_at", "curve", "market_date", "yields",
                "recorded_at");
             BulkRows seen = BulkRows.into(c, "seen_message", "message_id", "seq", "recorded_at")) {
            for (JournalEntries.AcceptedQuote a : e.quotes) {
                q.row(a.seq(), a.messageId(), a.origin(), a.source(), a.sentAt() == null ? null : Timestamp.from(a.sentAt()), a.curve(),
                        a.date(), YieldsText.write(a.yieldsBp()), now);
                if (a.messageId() != null) {
                    seen.row(a.messageId(), a.seq(), now);
                }
            }
            q.write();
            seen.write();
        }
    }

    private static void rejects(Connection c, JournalEntries e, Timestamp now) throws SQLException {
        if (e.rejects.isEmpty()) {
            return;
        }
        try (PreparedStatement s = c.prepareStatement("INSERT INTO reject (origin, reason, detail, item, raw, recorded_at) VALUES (?,?,?,?,?,?)")) {
            for (JournalEntries.RejectedQuote r : e.rejects) {
                s.setString(1, r.origin());
                s.setString(2, r.reason());
                s.setString(3, fit(r.detail(), 1000));
                s.setInt(4, r.item());
                s.setString(5, fit(r.raw(), 2100));
                s.setTimestamp(6, now);
                s.addBatch();
            }
            s.executeBatch();
        }
    }

    private static void observations(Connection c, JournalEntries e, Timestamp now) throws SQLException {
        if (e.observations.isEmpty()) {
            return;
        }
        try (BulkRows rows = BulkRows.into(c, "observation", "spread_id", "market_date", "value_bp", "seq", "recorded_at")) {
            for (JournalEntries.SpreadValue v : e.observations) {
                rows.row(v.spread().id(), v.observation().date(), v.observation().valueBp(), v.observation().sequence(), now);
            }
            rows.write();
        }
    }

    /**
     * Transitions and spells in batches, each revision and restatement where it came: a revision
     * marks as superseded the transitions journalled before it (earlier in this step too) and
     * rewrites its spread's spells, and a restatement writes over spells perhaps reported earlier in
     * this step, so what the monitors reported before it must be written before it.
     */
    private static void conclusions(Connection c, List<JournalEntries.Conclusion> all, Timestamp now) throws SQLException {
        List<Transition> transitions = new ArrayList<>();
        List<Spell> spells = new ArrayList<>();
        for (JournalEntries.Conclusion x : all) {
            if (x instanceof JournalEntries.TransitionEntry t) {
                transitions.add(t.transition());
            } else if (x instanceof JournalEntries.SpellEntry sp) {
                spells.add(sp.spell());
            } else if (x instanceof JournalEntries.RevisionEntry r) {
                flush(c, transitions, spells, now);
                revision(c, r, now);
            } else if (x instanceof JournalEntries.RestatementEntry r) {
                flush(c, transitions, spells, now);
                restatement(c, r.restatement(), now);
            }
        }
        flush(c, transitions, spells, now);
    }

    private static void flush(Connection c, List<Transition> transitions, List<Spell> spells, Timestamp now) throws SQLException {
        transitions(c, transitions, now);
        spells(c, spells, now);
        transitions.clear();
        spells.clear();
    }

    private static void revision(Connection c, JournalEntries.RevisionEntry entry, Timestamp now) throws SQLException {
        var r = entry.revision();
        long revisionId;
        try (PreparedStatement s = c.prepareStatement("INSERT INTO revision (spread_id, from_date, before_text, after_text, seq, recorded_at) "
                + "VALUES (?,?,?,?,?,?)", new String[] {"id"})) {
            s.setString(1, r.spread().id());
            s.setDate(2, Date.valueOf(r.from()));
            s.setString(3, fit(lines(r.before()), 4000));
            s.setString(4, fit(lines(r.after()), 4000));
            s.setLong(5, r.sequence());
            s.setTimestamp(6, now);
            s.executeUpdate();
            try (var keys = s.getGeneratedKeys()) {
                keys.next();
                revisionId = keys.getLong(1);
            }
        }
        try (PreparedStatement s = c.prepareStatement("UPDATE transition SET superseded_by = ? "
                + "WHERE spread_id = ? AND market_date >= ? AND superseded_by IS NULL")) {
            s.setLong(1, revisionId);
            s.setString(2, r.spread().id());
            s.setDate(3, Date.valueOf(r.from()));
            s.executeUpdate();
        }
        transitions(c, r.after(), now);
        // The spells that can have changed, and only those: a spell that ended before the revised date
        // is made of earlier values alone, which the revision leaves as they were (so its row, its id
        // and the ids before it stand, and the ids after it are numbered on from them as before); one
        // ending on or after it may have changed, ended on another date, become open or gone, so those
        // rows go and the spells ending on or after it now are written.
        try (PreparedStatement s = c.prepareStatement("DELETE FROM spell WHERE spread_id = ? AND end_date >= ?")) {
            s.setString(1, r.spread().id());
            s.setDate(2, Date.valueOf(r.from()));
            s.executeUpdate();
        }
        spells(c, r.spells(), now);
    }

    /** The restated spells' rows go by their ids and the spells as they now stand take their place. */
    private static void restatement(Connection c, SpellRestatement r, Timestamp now) throws SQLException {
        try (PreparedStatement s = c.prepareStatement("DELETE FROM spell WHERE spread_id = ? AND spell_id = ?")) {
            for (Spell sp : r.spells()) {
                s.setString(1, r.spread().id());
                s.setLong(2, sp.id());
                s.addBatch();
            }
            s.executeBatch();
        }
        spells(c, r.spells(), now);
    }

    private static void transitions(Connection c, List<Transition> transitions, Timestamp now) throws SQLException {
        if (transitions.isEmpty()) {
            return;
        }
        try (PreparedStatement s = c.prepareStatement("INSERT INTO transition (spread_id, market_date, from_state, to_state, reason, test, "
                + "window_label, measured, limit_value, value_bp, days_inverted, spell_id, seq, recorded_at) VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?)")) {
            for (Transition t : transitions) {
                s.setString(1, t.spread().id());
                s.setDate(2, Date.valueOf(t.date()));
                s.setString(3, t.from().name());
                s.setString(4, t.to().name());
                s.setString(5, fit(t.reason(), 400));
                s.setString(6, t.evidence().test());
                s.setString(7, t.evidence().window());
                s.setDouble(8, t.evidence().measured());
                s.setDouble(9, t.evidence().limit());
                s.setDouble(10, t.evidence().valueBp());
                s.setLong(11, t.evidence().daysInverted());
                s.setLong(12, t.spellId());
                s.setLong(13, t.sequence());
                s.setTimestamp(14, now);
                s.addBatch();
            }
            s.executeBatch();
        }
    }

    private static void spells(Connection c, List<Spell> spells, Timestamp now) throws SQLException {
        if (spells.isEmpty()) {
            return;
        }
        try (PreparedStatement s = c.prepareStatement("INSERT INTO spell (spread_id, spell_id, start_date, confirmed_date, confirmed_by, "
                + "end_date, duration_days, observations, deepest_bp, deepest_date, area_bp_days, recorded_at) VALUES (?,?,?,?,?,?,?,?,?,?,?,?)")) {
            for (Spell sp : spells) {
                s.setString(1, sp.spread().id());
                s.setLong(2, sp.id());
                s.setDate(3, Date.valueOf(sp.start()));
                setDate(s, 4, sp.confirmed());
                s.setString(5, sp.confirmedBy());
                s.setDate(6, Date.valueOf(sp.end()));
                s.setLong(7, sp.durationDays());
                s.setInt(8, sp.observations());
                s.setDouble(9, sp.deepestBp());
                s.setDate(10, Date.valueOf(sp.deepestDate()));
                s.setDouble(11, sp.invertedAreaBpDays());
                s.setTimestamp(12, now);
                s.addBatch();
            }
            s.executeBatch();
        }
    }

    private static void setDate(PreparedStatement s, int index, LocalDate date) throws SQLException {
        if (date == null) {
            s.setNull(index, Types.DATE);
        } else {
            s.setDate(index, Date.valueOf(date));
        }
    }

    private static String lines(List<Transition> transitions) {
        return transitions.stream().map(Transition::toString).collect(Collectors.joining("\n"));
    }

    /**
     * A text as its column can hold it: cut to {@code max} characters with an ellipsis, and NUL
     * replaced by U+FFFD, because a PostgreSQL text column refuses NUL and the failed write would
     * refuse the whole step with it. Rejects and delivery answers repeat what was sent to us.
     */
    static String fit(String s, int max) {
        if (s == null) {
            return null;
        }
        String text = s.indexOf('\0') < 0 ? s : s.replace('\0', '\uFFFD');
        return text.length() <= max ? text : text.substring(0, max - 1) + "…";
    }
}
