package org.slopewatch.journal;

import java.io.IOException;
import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import javax.sql.DataSource;
import org.slopewatch.delivery.Alert;
import org.slopewatch.rules.Severity;

/**
 * The alert part of the journal: notices, the per-channel outbox, delivery attempts,
 * acknowledgements, mutes and policy versions. Notices are inserted by {@link JournalWriter} in
 * the transaction of the step that decided them; the rest is read and written here.
 */
public final class AlertStore {

    /** Outbox states. */
    public enum Status { PENDING, DELIVERED, FAILED, SKIPPED }

    /** One delivery of one alert to one channel as it stands. */
    public record Delivery(String alertId, String channel, Status status, int attempts, Instant nextAttemptAt,
                           Instant firstAttemptAt, String lastDetail, Instant updatedAt) {
    }

    /** A stored notice with what the rule engine needs to pick up its episode after a restart. */
    public record StoredAlert(Alert alert, String subject, LocalDate episodeSince, int notice, String mutedBy, String policyHash,
                              Instant recordedAt) {
    }

    /** A stored notice with its deliveries and acknowledgements, as the API lists it. */
    public record AlertView(StoredAlert stored, List<Delivery> deliveries, List<Ack> acks) {
    }

    public record Ack(String alertId, String by, String note, Instant at) {
    }

    public record Mute(long id, String kind, String target, Instant until, String reason, String by, Instant createdAt,
                       Instant liftedAt, String liftedBy) {

        public boolean activeAt(Instant now) {
            return liftedAt == null && until.isAfter(now);
        }
    }

    /** One journalled delivery attempt. */
    public record Attempt(String channel, int attempt, String outcome, String detail, String decision, Instant attemptedAt) {
    }

    /** One journalled delivery attempt with its alert and when it was recorded, for timelines and as-of answers. */
    public record StoredAttempt(long id, String alertId, String channel, int attempt, String outcome, String detail, String decision,
                                Instant attemptedAt, Instant recordedAt) {
    }

    /** A delivery due now, with its alert. */
    public record Due(Alert alert, Delivery delivery) {
    }

    /** What the journal's columns hold (V2__alerts.sql): who acts, an acknowledgement's note, a mute's reason and target. */
    public static final int BY_CHARS = 100;
    public static final int NOTE_CHARS = 400;
    public static final int REASON_CHARS = 400;
    public static final int TARGET_CHARS = 120;
    /** {@code alert.muted_by}: the mute that silenced a notice, described with its reason, can be longer. */
    static final int MUTED_BY_CHARS = 400;

    static final String ALERT_COLUMNS = "a.id, a.rule, a.subject, a.episode_since, a.notice, a.kind, a.severity, a.market_date, "
            + "a.state, a.title, a.body, a.facts, a.dashboard, a.muted_by, a.policy_hash, a.created_at, a.recorded_at";
    private static final String DELIVERY_COLUMNS = "d.alert_id, d.channel, d.status, d.attempts, d.next_attempt_at, d.first_attempt_at, "
            + "d.last_detail, d.updated_at";

    private final DataSource dataSource;
    private final Clock clock;

    public AlertStore(DataSource dataSource, Clock clock) {
        this.dataSource = dataSource;
        this.clock = clock;
    }

    /** Inserts notices not stored yet and their outbox rows; part of the caller's transaction. */
    static void insert(Connection c, List<JournalEntries.AlertEntry> alerts, Timestamp now) throws SQLException {
        if (alerts.isEmpty()) {
            return;
        }
        try (PreparedStatement exists = c.prepareStatement("SELECT 1 FROM alert WHERE id = ?");
             PreparedStatement a = c.prepareStatement("INSERT INTO alert (id, rule, subject, episode_since, notice, kind, severity, "
                     + "market_date, state, title, body, facts, dashboard, muted_by, policy_hash, seq, created_at, recorded_at) "
                     + "VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?)");
             PreparedStatement d = c.prepareStatement("INSERT INTO delivery (alert_id, channel, status, attempts, next_attempt_at, "
                     + "last_detail, updated_at, recorded_at) VALUES (?,?,?,0,?,?,?,?)")) {
            for (JournalEntries.AlertEntry e : alerts) {
                Alert alert = e.alert();
                exists.setString(1, alert.id());
                try (ResultSet rs = exists.executeQuery()) {
                    if (rs.next()) {
                        continue; // decided before (a restart or another instance): never twice
                    }
                }
                a.setString(1, alert.id());
                a.setString(2, alert.rule());
                a.setString(3, e.subject());
                a.setDate(4, e.episodeSince() == null ? null : Date.valueOf(e.episodeSince()));
                a.setInt(5, e.notice());
                a.setString(6, alert.kind().name());
                a.setString(7, alert.severity().name());
                a.setDate(8, alert.marketDate() == null ? null : Date.valueOf(alert.marketDate()));
                a.setString(9, alert.state());
                a.setString(10, JournalWriter.fit(alert.subject(), 400));
                a.setString(11, JournalWriter.fit(alert.text(), 8000));
                a.setString(12, JournalWriter.fit(FactsText.write(alert.facts()), 4000));
                a.setString(13, alert.dashboard());
                a.setString(14, JournalWriter.fit(e.mutedBy(), MUTED_BY_CHARS));
                a.setString(15, e.policyHash());
                if (e.seq() == null) {
                    a.setNull(16, java.sql.Types.BIGINT);
                } else {
                    a.setLong(16, e.seq());
                }
                a.setTimestamp(17, Timestamp.from(alert.createdAt()));
                a.setTimestamp(18, now);
                a.executeUpdate();
                for (JournalEntries.Outbox o : e.outbox()) {
                    d.setString(1, alert.id());
                    d.setString(2, o.channel());
                    d.setString(3, (o.skipped() == null ? Status.PENDING : Status.SKIPPED).name());
                    d.setTimestamp(4, o.skipped() == null ? Timestamp.from(alert.createdAt()) : null);
                    d.setString(5, JournalWriter.fit(o.skipped(), 1000));
                    d.setTimestamp(6, now);
                    d.setTimestamp(7, now);
                    d.addBatch();
                }
            }
            d.executeBatch();
        }
    }

    /** Deliveries of a channel due at {@code now}, oldest first. */
    public List<Due> due(String channel, Instant now, int limit) {
        String sql = "SELECT " + ALERT_COLUMNS + ", " + DELIVERY_COLUMNS + " FROM delivery d JOIN alert a ON a.id = d.alert_id "
                + "WHERE d.channel = ? AND d.status = 'PENDING' AND d.next_attempt_at <= ? ORDER BY d.next_attempt_at, a.created_at "
                + "FETCH FIRST " + limit + " ROWS ONLY";
        List<Due> out = new ArrayList<>();
        query(sql, s -> {
            s.setString(1, channel);
            s.setTimestamp(2, Timestamp.from(now));
        }, rs -> out.add(new Due(alert(rs).alert(), delivery(rs, 18))));
        return out;
    }

    /**
     * Claims a due delivery for one attempt by this instance, until {@code until}. False when
     * another instance holds an unexpired claim, or the row has moved on since it was read (an
     * attempt recorded, the delivery finished): then this instance must not attempt it.
     */
    public boolean claim(Delivery d, String instance, Instant now, Instant until) {
        int[] n = {0};
        inTransaction(c -> {
            try (PreparedStatement s = c.prepareStatement("UPDATE delivery SET claimed_by = ?, claimed_until = ? "
                    + "WHERE alert_id = ? AND channel = ? AND status = 'PENDING' AND attempts = ? "
                    + "AND (claimed_until IS NULL OR claimed_until < ? OR claimed_by = ?)")) {
                s.setString(1, instance);
                s.setTimestamp(2, Timestamp.from(until));
                s.setString(3, d.alertId());
                s.setString(4, d.channel());
                s.setInt(5, d.attempts());
                s.setTimestamp(6, Timestamp.from(now));
                s.setString(7, instance);
                n[0] = s.executeUpdate();
            }
        });
        return n[0] == 1;
    }

    /**
     * Records one attempt and where the delivery stands after it, in one transaction.
     *
     * @param next   when to try again, or null when the delivery is finished
     * @param status PENDING with {@code next}, or DELIVERED / FAILED
     */
    public void attempt(Delivery before, Instant attemptedAt, String outcome, String detail, String decision, Status status,
                        Instant next) {
        Timestamp now = Timestamp.from(clock.instant());
        inTransaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO delivery_attempt (alert_id, channel, attempt, outcome, detail, "
                    + "decision, attempted_at, recorded_at) VALUES (?,?,?,?,?,?,?,?)")) {
                s.setString(1, before.alertId());
                s.setString(2, before.channel());
                s.setInt(3, before.attempts() + 1);
                s.setString(4, outcome);
                s.setString(5, JournalWriter.fit(detail, 1000));
                s.setString(6, JournalWriter.fit(decision, 1000));
                s.setTimestamp(7, Timestamp.from(attemptedAt));
                s.setTimestamp(8, now);
                s.executeUpdate();
            }
            try (PreparedStatement s = c.prepareStatement("UPDATE delivery SET status = ?, attempts = attempts + 1, next_attempt_at = ?, "
                    + "first_attempt_at = COALESCE(first_attempt_at, ?), last_detail = ?, updated_at = ?, claimed_by = NULL, "
                    + "claimed_until = NULL WHERE alert_id = ? AND channel = ?")) {
                s.setString(1, status.name());
                s.setTimestamp(2, next == null ? null : Timestamp.from(next));
                s.setTimestamp(3, Timestamp.from(attemptedAt));
                s.setString(4, JournalWriter.fit(decision, 1000));
                s.setTimestamp(5, now);
                s.setString(6, before.alertId());
                s.setString(7, before.channel());
                s.executeUpdate();
            }
        });
    }

    /** Pending deliveries, all channels: the outbox backlog. */
    public long backlog() {
        long[] n = {0};
        query("SELECT COUNT(*) FROM delivery WHERE status = 'PENDING'", s -> { }, rs -> n[0] = rs.getLong(1));
        return n[0];
    }

    /** The newest alerts with their deliveries and acknowledgements, newest first. */
    public List<AlertView> recent(int limit) {
        Map<String, StoredAlert> alerts = new LinkedHashMap<>();
        query("SELECT " + ALERT_COLUMNS + " FROM alert a ORDER BY a.created_at DESC, a.id DESC FETCH FIRST " + limit + " ROWS ONLY",
                s -> { }, rs -> {
                    StoredAlert a = alert(rs);
                    alerts.put(a.alert().id(), a);
                });
        return views(alerts);
    }

    /** One alert with its deliveries and acknowledgements, or null. */
    public AlertView find(String id) {
        Map<String, StoredAlert> alerts = new LinkedHashMap<>();
        query("SELECT " + ALERT_COLUMNS + " FROM alert a WHERE a.id = ?", s -> s.setString(1, id), rs -> {
            StoredAlert a = alert(rs);
            alerts.put(a.alert().id(), a);
        });
        List<AlertView> views = views(alerts);
        return views.isEmpty() ? null : views.get(0);
    }

    private List<AlertView> views(Map<String, StoredAlert> alerts) {
        return views(alerts, null);
    }

    /** The alerts with their deliveries and acknowledgements as they stood at {@code asOf} (null: now). */
    List<AlertView> views(Map<String, StoredAlert> alerts, Instant asOf) {
        if (alerts.isEmpty()) {
            return List.of();
        }
        Map<String, List<Delivery>> deliveries = new LinkedHashMap<>();
        Map<String, List<Ack>> acks = new LinkedHashMap<>();
        String recordedBy = asOf == null ? "" : " AND recorded_at <= ?";
        for (List<String> ids : chunks(List.copyOf(alerts.keySet()))) {
            String in = String.join(",", java.util.Collections.nCopies(ids.size(), "?"));
            query("SELECT " + DELIVERY_COLUMNS + " FROM delivery d WHERE d.alert_id IN (" + in + ") ORDER BY d.channel", s -> bind(s, ids),
                    rs -> deliveries.computeIfAbsent(rs.getString(1), k -> new ArrayList<>()).add(delivery(rs, 1)));
            query("SELECT alert_id, acked_by, note, recorded_at FROM alert_ack WHERE alert_id IN (" + in + ")" + recordedBy + " ORDER BY id",
                    s -> {
                        bind(s, ids);
                        if (asOf != null) {
                            s.setTimestamp(ids.size() + 1, Timestamp.from(asOf));
                        }
                    }, rs -> acks.computeIfAbsent(rs.getString(1), k -> new ArrayList<>()).add(ack(rs)));
        }
        Map<String, List<StoredAttempt>> attempts = new LinkedHashMap<>();
        if (asOf != null) {
            for (StoredAttempt a : attempts(List.copyOf(alerts.keySet()), asOf)) {
                attempts.computeIfAbsent(a.alertId() + "|" + a.channel(), k -> new ArrayList<>()).add(a);
            }
        }
        List<AlertView> out = new ArrayList<>();
        alerts.forEach((id, a) -> {
            List<Delivery> ds = deliveries.getOrDefault(id, List.of());
            if (asOf != null) {
                ds = ds.stream().map(d -> DeliveryAsOf.at(d, a, attempts.getOrDefault(id + "|" + d.channel(), List.of()))).toList();
            }
            out.add(new AlertView(a, ds, acks.getOrDefault(id, List.of())));
        });
        return out;
    }

    /** Id lists in pieces small enough for one IN list on any database. */
    private static List<List<String>> chunks(List<String> ids) {
        List<List<String>> out = new ArrayList<>();
        for (int i = 0; i < ids.size(); i += 500) {
            out.add(ids.subList(i, Math.min(ids.size(), i + 500)));
        }
        return out;
    }

    /** The newest alerts recorded at or before {@code asOf}, with their deliveries and acknowledgements as they stood then. */
    public List<AlertView> recent(int limit, Instant asOf) {
        if (asOf == null) {
            return recent(limit);
        }
        Map<String, StoredAlert> alerts = new LinkedHashMap<>();
        query("SELECT " + ALERT_COLUMNS + " FROM alert a WHERE a.recorded_at <= ? ORDER BY a.created_at DESC, a.id DESC FETCH FIRST "
                + limit + " ROWS ONLY", s -> s.setTimestamp(1, Timestamp.from(asOf)), rs -> {
                    StoredAlert a = alert(rs);
                    alerts.put(a.alert().id(), a);
                });
        return views(alerts, asOf);
    }

    /**
     * The alerts about one subject (a spread id) of a range, oldest first, at most {@code limit}:
     * those with a market date in the range, or with none; as the journal held them at the range's moment.
     */
    public List<AlertView> forSubject(JournalRange range, int limit) {
        Map<String, StoredAlert> alerts = new LinkedHashMap<>();
        query("SELECT " + ALERT_COLUMNS + " FROM alert a WHERE " + alertFilter(range) + " ORDER BY a.recorded_at, a.created_at, a.id "
                + "FETCH FIRST " + limit + " ROWS ONLY", range::bind, rs -> {
                    StoredAlert a = alert(rs);
                    alerts.put(a.alert().id(), a);
                });
        return views(alerts, range.asOf());
    }

    /** Every alert of a range ({@code spreadId} is the subject, null for all), streamed oldest first. */
    public void eachAlert(JournalRange range, RowSink<StoredAlert> sink) throws IOException {
        String sql = "SELECT " + ALERT_COLUMNS + " FROM alert a WHERE " + alertFilter(range) + " ORDER BY a.created_at, a.id";
        JournalCursor.stream(dataSource, sql, range::bind, rs -> {
            while (rs.next()) {
                sink.accept(alert(rs));
            }
        }, "alerts");
    }

    static String alertFilter(JournalRange range) {
        // notices without a market date (a stale feed) belong to every range
        return "(a.market_date IS NULL OR (a.market_date >= ? AND a.market_date <= ?))"
                + (range.spreadId() == null ? "" : " AND a.subject = ?") + (range.asOf() == null ? "" : " AND a.recorded_at <= ?");
    }

    /** The delivery attempts of some alerts recorded at or before {@code asOf} (null: all), in the order they were recorded. */
    public List<StoredAttempt> attempts(List<String> alertIds, Instant asOf) {
        List<StoredAttempt> out = new ArrayList<>();
        for (List<String> ids : chunks(alertIds)) {
            String in = String.join(",", java.util.Collections.nCopies(ids.size(), "?"));
            query("SELECT id, alert_id, channel, attempt, outcome, detail, decision, attempted_at, recorded_at FROM delivery_attempt "
                    + "WHERE alert_id IN (" + in + ")" + (asOf == null ? "" : " AND recorded_at <= ?") + " ORDER BY id", s -> {
                        bind(s, ids);
                        if (asOf != null) {
                            s.setTimestamp(ids.size() + 1, Timestamp.from(asOf));
                        }
                    }, rs -> out.add(new StoredAttempt(rs.getLong(1), rs.getString(2), rs.getString(3), rs.getInt(4), rs.getString(5),
                            rs.getString(6), rs.getString(7), instant(rs, 8), instant(rs, 9))));
        }
        out.sort(java.util.Comparator.comparingLong(StoredAttempt::id));
        return out;
    }

    /** Every delivery attempt of an alert, in the order they were made. */
    public List<Attempt> attempts(String alertId) {
        List<Attempt> out = new ArrayList<>();
        query("SELECT channel, attempt, outcome, detail, decision, attempted_at FROM delivery_attempt WHERE alert_id = ? ORDER BY id",
                s -> s.setString(1, alertId), rs -> out.add(new Attempt(rs.getString(1), rs.getInt(2), rs.getString(3), rs.getString(4),
                        rs.getString(5), instant(rs, 6))));
        return out;
    }

    /** The latest notice of every rule and subject: where each episode stands. */
    public List<StoredAlert> latestPerEpisode() {
        Map<String, StoredAlert> latest = new LinkedHashMap<>();
        query("SELECT " + ALERT_COLUMNS + " FROM alert a ORDER BY a.created_at, a.notice", s -> { }, rs -> {
            StoredAlert a = alert(rs);
            latest.put(a.alert().rule() + "|" + a.subject(), a);
        });
        return List.copyOf(latest.values());
    }

    /**
     * Every notice of the given kinds, oldest first, without deliveries: what did fire, for a
     * what-if to compare with.
     */
    public List<StoredAlert> notices(Set<Alert.Kind> kinds) {
        List<StoredAlert> out = new ArrayList<>();
        if (kinds.isEmpty()) {
            return out;
        }
        List<String> names = kinds.stream().map(Enum::name).sorted().toList();
        String in = String.join(",", java.util.Collections.nCopies(names.size(), "?"));
        query("SELECT " + ALERT_COLUMNS + " FROM alert a WHERE a.kind IN (" + in + ") ORDER BY a.created_at, a.id", s -> bind(s, names),
                rs -> out.add(alert(rs)));
        return out;
    }

    /** Acknowledgements of the alerts of one episode (same rule, subject and start). */
    public boolean episodeAcknowledged(String rule, String subject, LocalDate since) {
        boolean[] found = {false};
        query("SELECT 1 FROM alert_ack k JOIN alert a ON a.id = k.alert_id WHERE a.rule = ? AND a.subject = ? AND a.episode_since = ?",
                s -> {
                    s.setString(1, rule);
                    s.setString(2, subject);
                    s.setDate(3, Date.valueOf(since));
                }, rs -> found[0] = true);
        return found[0];
    }

    public void ack(String alertId, String by, String note) {
        Timestamp now = Timestamp.from(clock.instant());
        inTransaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO alert_ack (alert_id, acked_by, note, recorded_at) VALUES (?,?,?,?)")) {
                s.setString(1, alertId);
                s.setString(2, JournalWriter.fit(by, BY_CHARS));
                s.setString(3, JournalWriter.fit(note, NOTE_CHARS));
                s.setTimestamp(4, now);
                s.executeUpdate();
            }
        });
    }

    /** Stores a mute and returns it with its id. */
    public Mute mute(String kind, String target, Instant until, String reason, String by) {
        Instant now = clock.instant();
        long[] id = {0};
        inTransaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO mute (target_kind, target, until_at, reason, muted_by, recorded_at) "
                    + "VALUES (?,?,?,?,?,?)", new String[] {"id"})) {
                s.setString(1, kind);
                s.setString(2, JournalWriter.fit(target, TARGET_CHARS));
                s.setTimestamp(3, Timestamp.from(until));
                s.setString(4, JournalWriter.fit(reason, REASON_CHARS));
                s.setString(5, JournalWriter.fit(by, BY_CHARS));
                s.setTimestamp(6, Timestamp.from(now));
                s.executeUpdate();
                try (ResultSet keys = s.getGeneratedKeys()) {
                    keys.next();
                    id[0] = keys.getLong(1);
                }
            }
        });
        return new Mute(id[0], kind, target, until, reason, by, now, null, null);
    }

    /** Ends a mute early; false when there is no such mute or it was lifted already. */
    public boolean lift(long id, String by) {
        Timestamp now = Timestamp.from(clock.instant());
        int[] n = {0};
        inTransaction(c -> {
            try (PreparedStatement s = c.prepareStatement("UPDATE mute SET lifted_at = ?, lifted_by = ? WHERE id = ? AND lifted_at IS NULL")) {
                s.setTimestamp(1, now);
                s.setString(2, JournalWriter.fit(by, BY_CHARS));
                s.setLong(3, id);
                n[0] = s.executeUpdate();
            }
        });
        return n[0] == 1;
    }

    /** All mutes, newest first. */
    public List<Mute> mutes() {
        List<Mute> out = new ArrayList<>();
        query("SELECT id, target_kind, target, until_at, reason, muted_by, recorded_at, lifted_at, lifted_by FROM mute ORDER BY id DESC",
                s -> { }, rs -> out.add(new Mute(rs.getLong(1), rs.getString(2), rs.getString(3), instant(rs, 4), rs.getString(5),
                        rs.getString(6), instant(rs, 7), instant(rs, 8), rs.getString(9))));
        return out;
    }

    /** Journals a policy load: its content hash, where it came from, applied or rejected and why. */
    public void policyVersion(String hash, String source, String outcome, String detail) {
        Timestamp now = Timestamp.from(clock.instant());
        inTransaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO policy_version (content_hash, source, outcome, detail, recorded_at) "
                    + "VALUES (?,?,?,?,?)")) {
                s.setString(1, hash);
                s.setString(2, JournalWriter.fit(source, 400));
                s.setString(3, outcome);
                s.setString(4, JournalWriter.fit(detail, 4000));
                s.setTimestamp(5, now);
                s.executeUpdate();
            }
        });
    }

    /** The hash of the last policy applied at or before {@code asOf}: the rule set in force then, or null before the first. */
    public String policyHashAt(Instant asOf) {
        String[] hash = {null};
        query("SELECT content_hash FROM policy_version WHERE outcome = 'applied' AND recorded_at <= ? ORDER BY recorded_at DESC, id DESC "
                + "FETCH FIRST 1 ROWS ONLY", s -> s.setTimestamp(1, Timestamp.from(asOf)), rs -> hash[0] = rs.getString(1));
        return hash[0];
    }

    /** The hash of the policy applied last, or null. */
    public String currentPolicyHash() {
        String[] hash = {null};
        query("SELECT content_hash FROM policy_version WHERE outcome = 'applied' ORDER BY id DESC FETCH FIRST 1 ROWS ONLY", s -> { },
                rs -> hash[0] = rs.getString(1));
        return hash[0];
    }

    static StoredAlert alert(ResultSet rs) throws SQLException {
        Date since = rs.getDate(4);
        Date market = rs.getDate(8);
        Alert alert = new Alert(rs.getString(1), rs.getString(2), Severity.valueOf(rs.getString(7)), Alert.Kind.valueOf(rs.getString(6)),
                rs.getString(3), market == null ? null : market.toLocalDate(), rs.getString(9), rs.getString(10), rs.getString(11),
                FactsText.read(rs.getString(12)), rs.getString(13), instant(rs, 16));
        return new StoredAlert(alert, rs.getString(3), since == null ? null : since.toLocalDate(), rs.getInt(5), rs.getString(14),
                rs.getString(15), instant(rs, 17));
    }

    private static Delivery delivery(ResultSet rs, int first) throws SQLException {
        return new Delivery(rs.getString(first), rs.getString(first + 1), Status.valueOf(rs.getString(first + 2)), rs.getInt(first + 3),
                instant(rs, first + 4), instant(rs, first + 5), rs.getString(first + 6), instant(rs, first + 7));
    }

    private static Ack ack(ResultSet rs) throws SQLException {
        return new Ack(rs.getString(1), rs.getString(2), rs.getString(3), instant(rs, 4));
    }

    private static Instant instant(ResultSet rs, int column) throws SQLException {
        Timestamp t = rs.getTimestamp(column);
        return t == null ? null : t.toInstant();
    }

    private static void bind(PreparedStatement s, List<String> values) throws SQLException {
        for (int i = 0; i < values.size(); i++) {
            s.setString(i + 1, values.get(i));
        }
    }

    @FunctionalInterface
    private interface Binder {
        void bind(PreparedStatement s) throws SQLException;
    }

    @FunctionalInterface
    private interface RowHandler {
        void row(ResultSet rs) throws SQLException;
    }

    @FunctionalInterface
    private interface Work {
        void run(Connection c) throws SQLException;
    }

    private void query(String sql, Binder binder, RowHandler handler) {
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement(sql)) {
            binder.bind(s);
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    handler.row(rs);
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read alerts from the journal", e);
        }
    }

    /**
     * Runs {@code work} in one transaction and returns once it is on disk, so that an attempt
     * recorded as made is not made again after a crash.
     */
    private void inTransaction(Work work) {
        try (Connection c = dataSource.getConnection()) {
            c.setAutoCommit(false);
            try {
                work.run(c);
                JournalDurability.commit(c);
            } catch (SQLException | RuntimeException e) {
                c.rollback();
                throw e;
            }
        } catch (SQLException e) {
            throw new JournalException("cannot write alert records to the journal", e);
        }
    }
}
