package org.slopewatch.testsupport;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;

/**
 * What a journal concluded, read over JDBC in a form two runs can be compared by: every row of
 * the conclusions (transitions, spells, notices, deliveries) without the columns that depend on
 * when or by which process it was written (row ids, timestamps, sequence numbers, dashboard
 * links, claims). Two runs over the same quotes must give equal contents however often their
 * daemons were stopped, killed or rebalanced.
 */
public record JournalContents(long quotes, long distinctQuoteIds, List<String> transitions, List<String> spells, List<String> alerts,
                              List<String> deliveries) {

    public static JournalContents read(String url, String user, String password) {
        try (Connection c = DriverManager.getConnection(url, user, password)) {
            return read(c);
        } catch (SQLException e) {
            throw new AssertionError("cannot read the journal at " + url + ": " + e.getMessage(), e);
        }
    }

    /** The same, from a data source the test opened (a journal it drives in process). */
    public static JournalContents read(javax.sql.DataSource ds) {
        try (Connection c = ds.getConnection()) {
            return read(c);
        } catch (SQLException e) {
            throw new AssertionError("cannot read the journal: " + e.getMessage(), e);
        }
    }

    private static JournalContents read(Connection c) throws SQLException {
        try (Statement s = c.createStatement()) {
            return new JournalContents(
                    single(s, "SELECT COUNT(*) FROM quote"),
                    single(s, "SELECT COUNT(DISTINCT message_id) FROM quote"),
                    rows(s, "SELECT spread_id, market_date, from_state, to_state, reason, test, window_label, measured, limit_value, "
                            + "value_bp, days_inverted, spell_id, superseded_by IS NOT NULL FROM transition "
                            + "ORDER BY spread_id, market_date, from_state, to_state, superseded_by NULLS LAST"),
                    rows(s, "SELECT spread_id, spell_id, start_date, confirmed_date, confirmed_by, end_date, duration_days, observations, "
                            + "deepest_bp, deepest_date, area_bp_days FROM spell ORDER BY spread_id, spell_id"),
                    rows(s, "SELECT id, rule, subject, episode_since, notice, kind, severity, market_date, state, title, muted_by "
                            + "FROM alert ORDER BY id"),
                    rows(s, "SELECT alert_id, channel, status FROM delivery ORDER BY alert_id, channel"));
        }
    }

    /** The ids of the journalled quote messages. */
    public static Set<String> quoteIds(String url, String user, String password) {
        return column(url, user, password, "SELECT message_id FROM quote WHERE message_id IS NOT NULL");
    }

    /** Ids journalled as seen (table {@code seen_message}) whose quote message the journal does not hold. */
    public static Set<String> seenWithoutQuote(String url, String user, String password) {
        return column(url, user, password, "SELECT m.message_id FROM seen_message m WHERE NOT EXISTS "
                + "(SELECT 1 FROM quote q WHERE q.message_id = m.message_id)");
    }

    private static Set<String> column(String url, String user, String password, String query) {
        try (Connection c = DriverManager.getConnection(url, user, password); Statement s = c.createStatement();
             ResultSet rs = s.executeQuery(query)) {
            Set<String> out = new TreeSet<>();
            while (rs.next()) {
                out.add(rs.getString(1));
            }
            return out;
        } catch (SQLException e) {
            throw new AssertionError("cannot read the journal at " + url + ": " + e.getMessage(), e);
        }
    }

    /**
     * The check every fault run ends with: each of {@code quotes} messages journalled once, and the
     * same conclusions as the undisturbed run, row for row (transitions, spells, notices, deliveries).
     */
    public void assertEndsAs(JournalContents undisturbed, long quotes) {
        assertThat(quotes()).as("quote messages journalled").isEqualTo(quotes);
        assertThat(distinctQuoteIds()).as("distinct message ids journalled").isEqualTo(quotes);
        assertThat(transitions()).as("transitions").containsExactlyElementsOf(undisturbed.transitions());
        assertThat(spells()).as("spells").containsExactlyElementsOf(undisturbed.spells());
        assertThat(alerts()).as("notices").containsExactlyElementsOf(undisturbed.alerts());
        assertThat(deliveries()).as("deliveries").containsExactlyElementsOf(undisturbed.deliveries());
    }

    private static long single(Statement s, String sql) throws SQLException {
        try (ResultSet rs = s.executeQuery(sql)) {
            rs.next();
            return rs.getLong(1);
        }
    }

    private static List<String> rows(Statement s, String sql) throws SQLException {
        List<String> out = new ArrayList<>();
        try (ResultSet rs = s.executeQuery(sql)) {
            ResultSetMetaData meta = rs.getMetaData();
            while (rs.next()) {
                StringBuilder row = new StringBuilder();
                for (int i = 1; i <= meta.getColumnCount(); i++) {
                    row.append(i == 1 ? "" : " | ").append(rs.getString(i));
                }
                out.add(row.toString());
            }
        }
        return out;
    }
}
