package org.slopewatch.journal;

import java.sql.Timestamp;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.sql.DataSource;

/**
 * The notices newest first (by creation, then id), a page at a time: a page starts after the
 * position where the previous one ended, so that pages read one after another hold every notice
 * once, however many were stored meanwhile (a newer notice belongs before the first page).
 */
public final class NewestAlerts {

    /** Where a page ended: the creation time and id of its last notice. */
    public record Position(Instant createdAt, String id) {
    }

    private final JournalSql sql;
    private final AlertViews views;

    public NewestAlerts(DataSource dataSource) {
        this.sql = new JournalSql(dataSource);
        this.views = new AlertViews(sql, new DeliveryAttempts(dataSource));
    }

    /**
     * At most {@code limit} notices recorded at or before {@code asOf} (null: now) that come after
     * {@code after} (null: from the newest), with their deliveries and acknowledgements as they
     * stood then.
     */
    public List<AlertHistory.AlertView> page(int limit, Instant asOf, Position after) {
        String query = "SELECT " + AlertRows.ALERT_COLUMNS + " FROM alert a WHERE 1 = 1" + (asOf == null ? "" : " AND a.recorded_at <= ?")
                + (after == null ? "" : " AND (a.created_at < ? OR (a.created_at = ? AND a.id < ?))")
                + " ORDER BY a.created_at DESC, a.id DESC";
        Map<String, AlertHistory.StoredAlert> alerts = new LinkedHashMap<>();
        sql.query(query, s -> {
            int i = 1;
            if (asOf != null) {
                s.setTimestamp(i++, Timestamp.from(asOf));
            }
            if (after != null) {
                s.setTimestamp(i++, Timestamp.from(after.createdAt()));
                s.setTimestamp(i++, Timestamp.from(after.createdAt()));
                s.setString(i, after.id());
            }
        }, limit, rs -> {
            AlertHistory.StoredAlert a = AlertRows.alert(rs);
            alerts.put(a.alert().id(), a);
        }, "alerts");
        return views.of(alerts, asOf);
    }
}
