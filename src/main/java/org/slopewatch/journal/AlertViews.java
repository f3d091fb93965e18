package org.slopewatch.journal;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Completes stored notices with their deliveries and acknowledgements, as they stand or as they
 * stood at a moment: the outbox keeps only a delivery's latest state, so a past one is replayed
 * from the attempts recorded by then ({@link DeliveryAsOf}).
 */
final class AlertViews {

    private final JournalSql sql;
    private final DeliveryAttempts attempts;

    AlertViews(JournalSql sql, DeliveryAttempts attempts) {
        this.sql = sql;
        this.attempts = attempts;
    }

    /** The alerts, in the map's order, with their deliveries and acknowledgements as they stood at {@code asOf} (null: now). */
    List<AlertHistory.AlertView> of(Map<String, AlertHistory.StoredAlert> alerts, Instant asOf) {
        if (alerts.isEmpty()) {
            return List.of();
        }
        Map<String, List<DeliveryOutbox.Delivery>> deliveries = new LinkedHashMap<>();
        Map<String, List<AlertHistory.Ack>> acks = new LinkedHashMap<>();
        String recordedBy = asOf == null ? "" : " AND recorded_at <= ?";
        for (List<String> ids : JournalSql.chunks(List.copyOf(alerts.keySet()))) {
            String in = JournalSql.placeholders(ids.size());
            sql.query("SELECT " + AlertRows.DELIVERY_COLUMNS + " FROM delivery d WHERE d.alert_id IN (" + in + ") ORDER BY d.channel",
                    s -> JournalSql.bind(s, ids),
                    rs -> deliveries.computeIfAbsent(rs.getString(1), k -> new ArrayList<>()).add(AlertRows.delivery(rs, 1)), "alerts");
            sql.query("SELECT alert_id, acked_by, note, recorded_at FROM alert_ack WHERE alert_id IN (" + in + ")" + recordedBy
                    + " ORDER BY id", s -> {
                        JournalSql.bind(s, ids);
                        if (asOf != null) {
                            s.setTimestamp(ids.size() + 1, Timestamp.from(asOf));
                        }
                    }, rs -> acks.computeIfAbsent(rs.getString(1), k -> new ArrayList<>()).add(ack(rs)), "alerts");
        }
        Map<String, List<DeliveryAttempts.StoredAttempt>> tries = new LinkedHashMap<>();
        if (asOf != null) {
            for (DeliveryAttempts.StoredAttempt a : attempts.attempts(List.copyOf(alerts.keySet()), asOf)) {
                tries.computeIfAbsent(a.alertId() + "|" + a.channel(), k -> new ArrayList<>()).add(a);
            }
        }
        List<AlertHistory.AlertView> out = new ArrayList<>();
        alerts.forEach((id, a) -> {
            List<DeliveryOutbox.Delivery> ds = deliveries.getOrDefault(id, List.of());
            if (asOf != null) {
                ds = ds.stream().map(d -> DeliveryAsOf.at(d, a, tries.getOrDefault(id + "|" + d.channel(), List.of()))).toList();
            }
            out.add(new AlertHistory.AlertView(a, ds, acks.getOrDefault(id, List.of())));
        });
        return out;
    }

    /** An acknowledgement read with its alert id, who, note and time as the first four columns. */
    static AlertHistory.Ack ack(ResultSet rs) throws SQLException {
        return new AlertHistory.Ack(rs.getString(1), rs.getString(2), rs.getString(3), JournalSql.instant(rs, 4));
    }
}
