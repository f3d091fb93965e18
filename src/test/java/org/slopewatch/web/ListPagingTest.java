package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.agroal.api.AgroalDataSource;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.response.Response;
import jakarta.inject.Inject;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;

/**
 * The paging contract of the API's lists (docs/api.md, "Lists") on a running daemon with a
 * journal of its own: read page after page through the {@code Link: <…>; rel="next"} headers
 * (RFC 8288, section 3), each list holds every item once and in order, exactly the rows the
 * journal's own tables hold (read here with plain SQL in the documented order, not through the
 * daemon's readers), and the same items as one page large enough for all of them.
 *
 * <p>The journal: GOVT-A's and GOVT-B's 10Y−3M swing around zero on 120 business days from
 * 5 January 2026 (GOVT-A −10 bp and +10 bp on alternate days, GOVT-B −10 bp every third day), 20
 * days to a request, so that many rows share one recording time and pages end inside such groups;
 * then five of GOVT-A's early days revised (which supersedes transitions), rejected quotes before
 * and after the moment {@code middle}, quiet periods and acknowledgements. The policy
 * ({@code policies/paging.yaml}) changes state on most days and raises a notice for each spell.
 */
@QuarkusTest
@TestProfile(ListPagingTest.OwnJournal.class)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class ListPagingTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Duration PATIENCE = Duration.ofSeconds(60);
    private static final String A = "GOVT-A:10Y-3M";
    private static final String B = "GOVT-B:10Y-3M";
    /** RFC 8288, section 3: {@code Link: <target>; rel="next"}, the one link the API sends. */
    private static final Pattern NEXT = Pattern.compile("<([^>]*)>; rel=\"next\"");
    private static final int QUIET_PERIODS = 12;
    /** The moment between the third and the fourth request of quotes. */
    private static Instant middle;

    @Inject
    AgroalDataSource journal;

    /** A journal of its own; no clock-driven evaluation, so that nothing changes but what the test does. */
    public static final class OwnJournal implements QuarkusTestProfile {
        @Override
        public Map<String, String> getConfigOverrides() {
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.data-dir", Path.of(".", "target", "test-data", "paging-" + UUID.randomUUID().toString().substring(0, 8))
                    .toString());
            config.put("slopewatch.ingest.policy", "src/test/resources/policies/paging.yaml");
            config.put("slopewatch.alerts.evaluate-every", "1h");
            config.put("slopewatch.alerts.reload-check", "0s");
            config.put("slopewatch.alerts.delivery-poll", "100ms");
            return config;
        }
    }

    @Test
    @Order(1)
    void aJournalWithManyRowsOfEveryKind() {
        List<LocalDate> days = businessDays(LocalDate.of(2026, 1, 5), 120);
        for (int start = 0; start < days.size(); start += 20) {
            if (start == 60) {
                middle = Instant.now();
            }
            List<String> quotes = new ArrayList<>();
            for (int i = start; i < start + 20; i++) {
                quotes.add(snapshot("GOVT-A", days.get(i), i % 2 == 0 ? -10.0 : 10.0));
                quotes.add(snapshot("GOVT-B", days.get(i), i % 3 == 0 ? -10.0 : 10.0));
            }
            post(quotes, 200);
            if (start == 0) {
                post(rejects(days.get(0), 3), 400);
            }
        }
        List<String> revised = new ArrayList<>();
        for (int i = 10; i < 15; i++) {
            revised.add(snapshot("GOVT-A", days.get(i), i % 2 == 0 ? 10.0 : -10.0));
        }
        post(revised, 200);
        post(rejects(days.get(5), 23), 400);
        for (int i = 0; i < 4; i++) {
            post(rejects(days.get(i), 1), 400);
        }
        Awaitility.await("every notice delivered on the log channel").atMost(PATIENCE)
                .until(() -> count("SELECT COUNT(*) FROM delivery WHERE status = 'PENDING'") == 0 && count("SELECT COUNT(*) FROM alert") > 0);
        for (int i = 0; i < QUIET_PERIODS; i++) {
            given().contentType("application/json").body(Map.of("spread", "10Y-3M", "lasts", "PT1H", "note", "paging " + i, "set_by", "ops"))
                    .post("/api/quiet-periods").then().statusCode(201);
        }
        for (String id : column("SELECT id FROM alert WHERE subject = ? ORDER BY created_at, id", A).subList(0, 3)) {
            given().contentType("application/json").body(Map.of("by", "desk-lead")).post("/api/alerts/" + id + "/ack").then().statusCode(200);
        }
    }

    @Test
    @Order(2)
    void transitionsPageByPageAreTheJournalsInMarketDateOrder() {
        List<String> all = column("SELECT id FROM transition ORDER BY market_date, id");
        assertThat(all).as("enough transitions for many pages").hasSizeGreaterThan(200);
        assertThat(field(items(walk("/api/transitions?superseded=true&limit=7"), null), "id")).isEqualTo(all);

        List<String> standing = column("SELECT id FROM transition WHERE superseded_by IS NULL ORDER BY market_date, id");
        assertThat(standing).as("the revision superseded some").hasSizeLessThan(all.size());
        assertThat(field(items(walk("/api/transitions?limit=7"), null), "id")).isEqualTo(standing);

        List<JsonNode> ofB = items(walk("/api/transitions?spread=" + B + "&limit=11"), null);
        assertThat(field(ofB, "id")).isEqualTo(column("SELECT id FROM transition WHERE spread_id = ? AND superseded_by IS NULL "
                + "ORDER BY market_date, id", B));
        assertThat(ofB).as("the pages joined are one large page").isEqualTo(items(walk("/api/transitions?spread=" + B + "&limit=10000"), null));

        List<JsonNode> then = items(walk("/api/transitions?superseded=true&limit=7&as_of=" + middle), "items");
        assertThat(field(then, "id")).isEqualTo(column("SELECT id FROM transition WHERE recorded_at <= ? ORDER BY market_date, id", middle));
    }

    @Test
    @Order(3)
    void aSpreadsHistoryPageByPageIsTheLastValueOfEachDate() {
        List<JsonNode> points = items(walk("/api/spreads/" + A + "/history?limit=9"), null);
        assertThat(pairs(points)).isEqualTo(lastValueOfEachDate("SELECT market_date, value_bp FROM observation WHERE spread_id = ? "
                + "ORDER BY market_date, id", A));
        assertThat(points).hasSize(120);
        List<JsonNode> spring = items(walk("/api/spreads/" + A + "/history?from=2026-02-01&to=2026-04-30&limit=4"), null);
        assertThat(pairs(spring)).isEqualTo(lastValueOfEachDate("SELECT market_date, value_bp FROM observation WHERE spread_id = ? "
                + "AND market_date >= DATE '2026-02-01' AND market_date <= DATE '2026-04-30' ORDER BY market_date, id", A));
        List<JsonNode> then = items(walk("/api/spreads/" + A + "/history?limit=9&as_of=" + middle), "items");
        assertThat(pairs(then)).isEqualTo(lastValueOfEachDate("SELECT market_date, value_bp FROM observation WHERE spread_id = ? "
                + "AND recorded_at <= ? ORDER BY market_date, id", A, middle));
    }

    @Test
    @Order(4)
    void rejectsAlertsAndQuietPeriodsPageByPageNewestFirst() {
        List<String> rejects = column("SELECT id FROM reject ORDER BY id DESC");
        assertThat(rejects).hasSize(3 + 23 + 4);
        assertThat(field(items(walk("/api/rejects?limit=4"), null), "id")).isEqualTo(rejects);
        assertThat(field(items(walk("/api/rejects?limit=4&as_of=" + middle), "items"), "id"))
                .isEqualTo(column("SELECT id FROM reject WHERE recorded_at <= ? ORDER BY id DESC", middle)).hasSize(3);

        List<String> alerts = column("SELECT id FROM alert ORDER BY created_at DESC, id DESC");
        assertThat(alerts).as("enough notices for many pages").hasSizeGreaterThan(50);
        List<JsonNode> pages = walk("/api/alerts?limit=6");
        assertThat(field(items(pages, "recent"), "id")).isEqualTo(alerts);
        pages.forEach(p -> assertThat(p.get("open")).as("the open episodes on every page").isEqualTo(pages.get(0).get("open")));
        assertThat(field(items(walk("/api/alerts?limit=6&as_of=" + middle), "items"), "id"))
                .isEqualTo(column("SELECT id FROM alert WHERE recorded_at <= ? ORDER BY created_at DESC, id DESC", middle));
        JsonNode byDefault = walk("/api/alerts").get(0);
        assertThat(byDefault.get("recent")).as("100 a page unless limit says otherwise").hasSize(Math.min(100, alerts.size()));
        assertThat(byDefault.get("truncated").asBoolean()).isEqualTo(alerts.size() > 100);

        List<String> quietPeriods = column("SELECT id FROM mute ORDER BY id DESC");
        assertThat(quietPeriods).hasSize(QUIET_PERIODS);
        assertThat(field(items(walk("/api/quiet-periods?limit=5"), null), "id")).isEqualTo(quietPeriods);
        // the deprecated old path pages the same list (vocabulary: deprecation path)
        assertThat(field(items(walk("/api/mutes?limit=5"), null), "id")).isEqualTo(quietPeriods);
    }

    @Test
    @Order(5)
    void aTimelinePageByPageHoldsEveryRowOnceInRecordedOrder() {
        checkTimeline("", null);
        checkTimeline("&as_of=" + middle, middle);
    }

    private void checkTimeline(String query, Instant asOf) {
        List<JsonNode> items = items(walk("/api/spreads/" + A + "/timeline?limit=13" + query), "items");
        String recordedBy = asOf == null ? "" : " AND x.recorded_at <= ?";
        Object[] params = asOf == null ? new Object[] {A} : new Object[] {A, asOf};
        Map<String, Long> expected = new LinkedHashMap<>();
        expected.put("observation", count("SELECT COUNT(*) FROM observation x WHERE x.spread_id = ?" + recordedBy, params));
        expected.put("transition", count("SELECT COUNT(*) FROM transition x WHERE x.spread_id = ?" + recordedBy, params));
        expected.put("alert", count("SELECT COUNT(*) FROM alert x WHERE x.subject = ?" + recordedBy, params));
        expected.put("delivery-attempt", count("SELECT COUNT(*) FROM delivery_attempt x JOIN alert a ON a.id = x.alert_id "
                + "WHERE a.subject = ?" + recordedBy, params));
        expected.put("ack", count("SELECT COUNT(*) FROM alert_ack x JOIN alert a ON a.id = x.alert_id WHERE a.subject = ?" + recordedBy, params));
        Map<String, Long> found = new LinkedHashMap<>();
        expected.keySet().forEach(k -> found.put(k, items.stream().filter(i -> i.get("kind").asText().equals(k)).count()));
        assertThat(found).as("every row of the journal about %s%s", A, query).isEqualTo(expected);
        assertThat(items).as("more than ten pages").hasSizeGreaterThan(10 * 13);

        Set<String> seen = new HashSet<>();
        for (int i = 0; i < items.size(); i++) {
            JsonNode item = items.get(i);
            String key = item.get("kind").asText() + " " + (item.has("id") ? item.get("id").asText() : item.get("alert_id").asText() + " "
                    + item.get("recorded_at").asText());
            assertThat(seen.add(key)).as("item %d, %s, once", i, key).isTrue();
            if (i > 0) {
                assertThat(Instant.parse(item.get("recorded_at").asText())).as("item %d in recorded order", i)
                        .isAfterOrEqualTo(Instant.parse(items.get(i - 1).get("recorded_at").asText()));
            }
        }
        assertThat(items).as("the pages joined are one large page")
                .isEqualTo(items(walk("/api/spreads/" + A + "/timeline?limit=10000" + query), "items"));
    }

    @Test
    @Order(6)
    void aLimitOrCursorThatCannotBeReadIsRefusedAndALargeLimitIsTheMaximum() {
        for (String list : List.of("/api/transitions", "/api/spreads/" + A + "/history", "/api/rejects", "/api/alerts", "/api/quiet-periods",
                "/api/spreads/" + A + "/timeline", "/api/policy/instances")) {
            for (String limit : List.of("0", "-3", "ten", "1.5")) {
                given().get(list + "?limit=" + limit).then().statusCode(400);
            }
            given().get(list + "?after=not-a-cursor").then().statusCode(400);
        }
        // the transitions' maximum is 10,000 a page (docs/api.md): a larger limit is taken as it
        Response large = given().get("/api/transitions?superseded=true&limit=99999999999");
        assertThat(large.statusCode()).isEqualTo(200);
        assertThat(json(large)).hasSize((int) Math.min(10_000, count("SELECT COUNT(*) FROM transition")));
        assertThat(large.header("X-Slopewatch-Truncated")).isEqualTo("false");
    }

    @Test
    @Order(7)
    void whatA201CreatesIsWhereItsLocationSays() {
        Response created = given().contentType("application/json")
                .body(Map.of("rule", "first-inversion", "lasts", "PT2H", "note", "checking the location", "set_by", "ops")).post("/api/quiet-periods");
        assertThat(created.statusCode()).isEqualTo(201);
        String location = created.header("Location");
        // RFC 9110, 15.3.2: a 201 names the resource it created in Location
        assertThat(location).as("the quiet period's own URI").matches("https?://[^/]+/api/quiet-periods/" + json(created).get("id").asText());
        Response fetched = given().get(location);
        assertThat(fetched.statusCode()).isEqualTo(200);
        assertThat(json(fetched)).as("GET of the Location gives back what was created").isEqualTo(json(created));
        given().get("/api/quiet-periods/999999").then().statusCode(404);

        // an acknowledgement changes its alert, and the answer is that alert: RFC 9110, 8.7, Content-Location names it
        String id = column("SELECT id FROM alert WHERE subject = ? ORDER BY created_at DESC, id DESC", B).get(0);
        Response acked = given().contentType("application/json").body(Map.of("by", "desk-lead", "note", "seen")).post("/api/alerts/" + id + "/ack");
        assertThat(acked.statusCode()).isEqualTo(200);
        assertThat(acked.header("Content-Location")).isEqualTo("/api/alerts/" + id);
        JsonNode alert = json(given().get(acked.header("Content-Location"))).get("alert");
        assertThat(alert).as("the alert the answer showed, acknowledgement included").isEqualTo(json(acked));
        assertThat(alert.get("acks").findValuesAsText("note")).contains("seen");
    }

    @Test
    @Order(8)
    void theOldSpellingAsOfAnswersAsAsOfDoes() {
        for (String list : List.of("/api/transitions?superseded=true", "/api/spreads/" + A + "/history?from=2026-01-01", "/api/rejects?limit=5",
                "/api/alerts?limit=5", "/api/spreads/" + A + "/timeline?limit=50", "/api/spreads/" + A + "?x=1")) {
            JsonNode current = json(given().urlEncodingEnabled(false).get(list + "&as_of=" + middle));
            JsonNode old = json(given().urlEncodingEnabled(false).get(list + "&asOf=" + middle));
            assertThat(current.get("as_of").asText()).as(list).isEqualTo(middle.toString());
            assertThat(old).as("%s: asOf, deprecated, answers as as_of", list).isEqualTo(current);
            given().urlEncodingEnabled(false).get(list + "&asOf=" + middle + "&as_of=" + middle).then().statusCode(400);
        }
        Response old = given().urlEncodingEnabled(false).get("/api/transitions?superseded=true&limit=3&asOf=" + middle);
        assertThat(old.header("Link")).as("the next page is named with the current spelling").contains("as_of=" + middle)
                .doesNotContain("asOf");
        String csv = given().urlEncodingEnabled(false).get("/api/export/transitions?asOf=" + middle).then().statusCode(200)
                .extract().header("X-Slopewatch-As-Of");
        assertThat(csv).isEqualTo(middle.toString());
    }

    @Test
    @Order(9)
    void instancesPageByPageInTheOrderTheyFirstAppeared() throws SQLException {
        Instant hourAgo = Instant.now().minusSeconds(3600);
        try (Connection c = journal.getConnection(); PreparedStatement s = c.prepareStatement("INSERT INTO policy_in_force "
                + "(instance_id, content_hash, source, since, last_seen) VALUES (?, 'h-old', 'p.yaml', ?, ?)")) {
            for (int i = 0; i < 8; i++) {
                s.setString(1, "gone-" + (8 - i)); // ids out of alphabetical order: the list follows the rows
                s.setTimestamp(2, Timestamp.from(hourAgo));
                s.setTimestamp(3, Timestamp.from(hourAgo));
                s.executeUpdate();
            }
        }
        List<JsonNode> items = items(walk("/api/policy/instances?limit=3"), "items");
        assertThat(field(items, "instance")).isEqualTo(column("SELECT instance_id FROM policy_in_force ORDER BY id")).hasSize(9);
        assertThat(items.get(0).get("live").asBoolean()).as("this daemon, first in, beats").isTrue();
        assertThat(items.subList(1, 9)).allSatisfy(i -> assertThat(i.get("live").asBoolean()).as("%s", i).isFalse());
        JsonNode byDefault = walk("/api/policy/instances").get(0);
        assertThat(byDefault.get("items")).as("100 a page unless limit says otherwise").hasSize(9);
        assertThat(byDefault.get("this_instance").asText()).isEqualTo(items.get(0).get("instance").asText());
    }

    // --- helpers ---

    /**
     * Reads a list from its first page through each answer's next link, checking the contract on
     * every page: it says whether it is truncated, links the next page exactly when it is, and an
     * answer that is an object says the same in its body.
     */
    private static List<JsonNode> walk(String first) {
        List<JsonNode> pages = new ArrayList<>();
        String next = first;
        while (next != null) {
            Response r = given().urlEncodingEnabled(false).get(next);
            assertThat(r.statusCode()).as("%s: %s", next, r.asString()).isEqualTo(200);
            String truncated = r.header("X-Slopewatch-Truncated");
            assertThat(truncated).as("%s says whether more follow", next).isIn("true", "false");
            // other links may stand beside the next one (a deprecated path names its successor), each a field line of its own
            List<String> nextLinks = r.headers().getValues("Link").stream().filter(l -> l.endsWith("rel=\"next\"")).toList();
            String page = next;
            next = null;
            if (truncated.equals("true")) {
                assertThat(nextLinks).as("%s: one next link", page).hasSize(1);
                Matcher m = NEXT.matcher(nextLinks.get(0));
                assertThat(m.matches()).as("%s: a next link as RFC 8288 writes it, not %s", page, nextLinks.get(0)).isTrue();
                next = m.group(1);
            } else {
                assertThat(nextLinks).as("%s: no next link on the last page", page).isEmpty();
            }
            JsonNode body = json(r);
            if (body.isObject()) {
                assertThat(body.get("truncated").asBoolean()).as("%s: truncated in the body as in the header", page).isEqualTo(next != null);
                assertThat(body.get("next").isNull() ? null : body.get("next").asText()).as("%s: next in the body as in the link", page)
                        .isEqualTo(next);
            }
            pages.add(body);
            assertThat(pages).as("pages of %s", first).hasSizeLessThan(1_000);
        }
        return pages;
    }

    /** The items of the pages, in order: each page's {@code field}, or the page itself when it is a list (null). */
    private static List<JsonNode> items(List<JsonNode> pages, String field) {
        List<JsonNode> out = new ArrayList<>();
        pages.forEach(p -> (field == null ? p : p.get(field)).forEach(out::add));
        return out;
    }

    private static List<String> field(List<JsonNode> items, String name) {
        return items.stream().map(i -> i.get(name).asText()).toList();
    }

    private static List<String> pairs(List<JsonNode> points) {
        return points.stream().map(p -> p.get("date").asText() + " " + p.get("value_bp").asDouble()).toList();
    }

    /** The value of each date that stands: the last one recorded for it. */
    private List<String> lastValueOfEachDate(String sql, Object... params) {
        Map<String, String> byDate = new LinkedHashMap<>();
        query(sql, params, rs -> byDate.put(rs.getDate(1).toLocalDate().toString(), rs.getDate(1).toLocalDate() + " " + rs.getDouble(2)));
        return List.copyOf(byDate.values());
    }

    private List<String> column(String sql, Object... params) {
        List<String> out = new ArrayList<>();
        query(sql, params, rs -> out.add(rs.getString(1)));
        return out;
    }

    private long count(String sql, Object... params) {
        long[] n = {0};
        query(sql, params, rs -> n[0] = rs.getLong(1));
        return n[0];
    }

    @FunctionalInterface
    private interface Row {
        void read(ResultSet rs) throws SQLException;
    }

    /** Plain JDBC on the daemon's journal: the tables as they are, without the daemon's readers. */
    private void query(String sql, Object[] params, Row row) {
        try (Connection c = journal.getConnection(); PreparedStatement s = c.prepareStatement(sql)) {
            for (int i = 0; i < params.length; i++) {
                if (params[i] instanceof Instant t) {
                    s.setTimestamp(i + 1, Timestamp.from(t));
                } else {
                    s.setObject(i + 1, params[i]);
                }
            }
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    row.read(rs);
                }
            }
        } catch (SQLException e) {
            throw new IllegalStateException(sql, e);
        }
    }

    private static List<LocalDate> businessDays(LocalDate from, int n) {
        List<LocalDate> days = new ArrayList<>();
        for (LocalDate d = from; days.size() < n; d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                days.add(d);
            }
        }
        return days;
    }

    /** 3M at 500 bp and 10Y at 500 + spreadBp, so that 10Y − 3M = spreadBp. */
    private static String snapshot(String curve, LocalDate date, double spreadBp) {
        return "{\"curve\":\"" + curve + "\",\"date\":\"" + date + "\",\"unit\":\"bp\",\"yields\":{\"3M\":500.0,\"10Y\":" + (500.0 + spreadBp)
                + "}}";
    }

    /** Quotes of a tenor no curve has: each is rejected and journalled. */
    private static List<String> rejects(LocalDate date, int n) {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add("{\"curve\":\"GOVT-A\",\"tenor\":\"7Q\",\"date\":\"" + date + "\",\"yield\":4." + i + "}");
        }
        return out;
    }

    private static void post(List<String> quotes, int status) {
        given().contentType("application/json").body("[" + String.join(",", quotes) + "]").post("/api/quotes").then().statusCode(status);
    }

    private static JsonNode json(Response r) {
        try {
            return JSON.readTree(r.asString());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
