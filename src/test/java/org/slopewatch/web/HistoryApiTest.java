package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import de.siegmar.fastcsv.reader.CsvReader;
import de.siegmar.fastcsv.reader.CsvRecord;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.response.Response;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;

/**
 * History as the journal held it, over HTTP on a running daemon: as-of answers, the spread
 * timeline and the exports.
 *
 * <p>The story and where the expectations come from: GOVT-A's 10Y−3M is −20 bp (3M 500 bp, 10Y
 * 480 bp) on every business day of the first quarter of 2026, then on 1 April. The policy under
 * test ({@code policies/history.yaml}) enters below 0 bp and confirms when a complete calendar
 * quarter averages below 0 bp, so the monitor goes INVERTED on 2 January and CONFIRMED on
 * 1 April, and notices first-inversion and inversion-confirmed go out. That is the moment T1.
 * Then 2 January is revised to +30 bp: the inversion starts on 5 January instead, the quarter
 * still averages below zero, and the journal supersedes both transitions (it replaces every
 * transition from the revised date on). Then the policy file changes (another message) and is
 * reloaded. Asked about T1, every endpoint must answer as before the revision, naming the rule
 * set of the original file (SHA-256 of its bytes, computed here).
 */
@QuarkusTest
@TestProfile(HistoryApiTest.History.class)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class HistoryApiTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final String SPREAD = "GOVT-A:10Y-3M";
    private static final String FIRST = "first-inversion~GOVT-A:10Y-3M~2026-01-02~1";
    private static final String CONFIRMED = "inversion-confirmed~GOVT-A:10Y-3M~2026-04-01~1";
    private static final Duration PATIENCE = Duration.ofSeconds(30);
    /** Quote messages (one per business day) up to T1: 2 January to 31 March 2026, and 1 April. */
    private static final int UNTIL_T1 = businessDays(LocalDate.of(2026, 1, 2), LocalDate.of(2026, 4, 1)).size();
    static Path policyFile;
    static Instant beforeAnything;
    static Instant t1;
    static String originalHash;
    static String reloadedHash;

    /** A journal and a policy file of its own, no hot reload (the test reloads by hand), deliveries polled often. */
    public static final class History implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            Path dir = Path.of(".", "target", "test-data", "history-" + UUID.randomUUID().toString().substring(0, 8));
            try {
                Files.createDirectories(dir);
                policyFile = dir.resolve("policy.yaml");
                Files.copy(Path.of("src/test/resources/policies/history.yaml"), policyFile);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.data-dir", dir.toString());
            config.put("slopewatch.ingest.policy", policyFile.toString());
            config.put("slopewatch.alerts.reload-check", "0s");
            config.put("slopewatch.alerts.delivery-poll", "100ms");
            return config;
        }
    }

    @Test
    @Order(1)
    void aQuarterInvertedThenARevisionOfItsFirstDayThenANewRuleSet() throws Exception {
        originalHash = sha256(Files.readAllBytes(policyFile));
        beforeAnything = Instant.now();
        post(days(LocalDate.of(2026, 1, 2), LocalDate.of(2026, 3, 31), -20.0));
        post(days(LocalDate.of(2026, 4, 1), LocalDate.of(2026, 4, 1), -20.0));
        t1 = Instant.now();
        given().get("/api/transitions?spread=" + SPREAD).then().statusCode(200).body("date", equalTo(List.of("2026-01-02", "2026-04-01")));

        post(days(LocalDate.of(2026, 1, 2), LocalDate.of(2026, 1, 2), 30.0));
        given().contentType("application/json").body("[{\"curve\":\"GOVT-A\",\"tenor\":\"2Y\",\"date\":\"2026-04-01\",\"yeild\":4.5}]")
                .post("/api/quotes").then().statusCode(400);
        Files.writeString(policyFile, Files.readString(policyFile).replace("is confirmed inverted", "stays inverted"));
        reloadedHash = sha256(Files.readAllBytes(policyFile));
        given().post("/api/policy/reload").then().statusCode(200).body("result", equalTo("applied")).body("hash", equalTo(reloadedHash));
    }

    @Test
    @Order(2)
    void transitionsAsOfT1ShowTheOldOnesStandingAndNowTheyAreSuperseded() throws IOException {
        JsonNode then = json(given().get("/api/transitions?spread=" + SPREAD + "&superseded=true&as_of=" + t1));
        assertThat(then.get("as_of").asText()).isEqualTo(t1.toString());
        assertThat(then.get("policy_hash").asText()).as("the rule set of the original file").isEqualTo(originalHash);
        assertThat(dates(then.get("items"))).as("before the revision: inverted from 2 January").containsExactly("2026-01-02", "2026-04-01");
        then.get("items").forEach(t -> assertThat(t.get("superseded_by").isNull()).as("not superseded at T1").isTrue());

        JsonNode standing = json(given().get("/api/transitions?spread=" + SPREAD));
        assertThat(standing.isArray()).as("without as_of the answer keeps its old shape, a plain list").isTrue();
        assertThat(dates(standing)).as("after the revision: inverted from 5 January").containsExactly("2026-01-05", "2026-04-01");
        JsonNode all = json(given().get("/api/transitions?spread=" + SPREAD + "&superseded=true"));
        assertThat(all).hasSize(4);
        for (JsonNode t : all) {
            boolean fromT1 = Instant.parse(t.get("recorded_at").asText()).isBefore(t1);
            assertThat(t.get("superseded_by").isNull()).as("recorded before T1 means replaced by the revision: %s", t).isEqualTo(!fromT1);
        }
        JsonNode now = json(given().get("/api/transitions?spread=" + SPREAD + "&as_of=" + Instant.now()));
        assertThat(now.get("policy_hash").asText()).as("the reloaded rule set").isEqualTo(reloadedHash);
        assertThat(dates(now.get("items"))).containsExactly("2026-01-05", "2026-04-01");
        given().get("/api/transitions?as_of=yesterday").then().statusCode(400).body(containsString("ISO-8601 instant"));
    }

    @Test
    @Order(3)
    void theSpreadAsOfT1IsTheStateBeforeTheRevision() throws IOException {
        JsonNode then = json(given().get("/api/spreads/" + SPREAD + "?as_of=" + t1));
        assertThat(then.get("policy_hash").asText()).isEqualTo(originalHash);
        assertThat(then.get("recomputed_under").asText()).as("replayed under the rules in force now").isEqualTo(reloadedHash);
        assertThat(then.get("quotes_replayed").asInt()).as("the quarter's business days and 1 April, one message each")
                .isEqualTo(UNTIL_T1);
        assertThat(then.get("spread").get("state").asText()).isEqualTo("CONFIRMED");
        assertThat(then.get("spread").get("spell").get("start").asText()).isEqualTo("2026-01-02");
        assertThat(json(given().get("/api/spreads/" + SPREAD)).get("spell").get("start").asText()).isEqualTo("2026-01-05");
        given().get("/api/spreads/" + SPREAD + "?as_of=" + beforeAnything).then().statusCode(404);

        JsonNode history = json(given().get("/api/spreads/" + SPREAD + "/history?from=2026-01-02&to=2026-01-02&as_of=" + t1));
        assertThat(history.get("items").get(0).get("value_bp").asDouble()).as("the value standing at T1").isEqualTo(-20.0);
        given().get("/api/spreads/" + SPREAD + "/history?from=2026-01-02&to=2026-01-02").then().statusCode(200)
                .body("value_bp", equalTo(List.of(30.0f)));
        assertThat(json(given().get("/api/rejects?as_of=" + t1)).get("items")).as("the reject came after T1").isEmpty();
        assertThat(json(given().get("/api/rejects")).findValuesAsText("detail")).contains("unknown field 'yeild'");
        JsonNode alertsThen = json(given().get("/api/alerts?as_of=" + t1));
        assertThat(alertsThen.get("policy_hash").asText()).isEqualTo(originalHash);
        assertThat(alertsThen.get("items").findValuesAsText("id")).contains(FIRST, CONFIRMED);
    }

    @Test
    @Order(4)
    void theTimelineHasObservationsTransitionsAlertsAttemptsAndAcksInRecordedOrder() throws IOException {
        Awaitility.await("both notices delivered on the log channel").atMost(PATIENCE).until(() ->
                json(given().get("/api/spreads/" + SPREAD + "/timeline")).get("items").findValuesAsText("alert_id").containsAll(List.of(FIRST, CONFIRMED)));
        given().contentType("application/json").body("{\"by\":\"desk-lead\",\"note\":\"seen\"}").post("/api/alerts/" + CONFIRMED + "/ack")
                .then().statusCode(200);

        JsonNode timeline = json(given().get("/api/spreads/" + SPREAD + "/timeline"));
        assertThat(timeline.get("policy_hash").asText()).isEqualTo(reloadedHash);
        List<JsonNode> items = new ArrayList<>();
        timeline.get("items").forEach(items::add);
        for (int i = 1; i < items.size(); i++) {
            assertThat(Instant.parse(items.get(i).get("recorded_at").asText()))
                    .as("item %d in recorded order", i).isAfterOrEqualTo(Instant.parse(items.get(i - 1).get("recorded_at").asText()));
        }
        assertThat(items).filteredOn(i -> kind(i).equals("observation")).as("the values up to T1, then the revised one")
                .hasSize(UNTIL_T1 + 1);
        int inverted = index(items, "transition", "date", "2026-01-02");
        int firstAlert = index(items, "alert", "id", FIRST);
        int april = index(items, "observation", "date", "2026-04-01");
        int confirmed = index(items, "transition", "to", "CONFIRMED");
        int confirmAlert = index(items, "alert", "id", CONFIRMED);
        int revised = indexOfLast(items, "observation", "date", "2026-01-02");
        assertThat(index(items, "observation", "date", "2026-03-31")).as("a step's inputs before its conclusion").isLessThan(inverted);
        assertThat(List.of(inverted, firstAlert, april, confirmed, confirmAlert, revised)).as("the story's order").isSorted();
        assertThat(items.get(inverted).get("superseded_by").isNull()).as("the revision replaced it").isFalse();
        assertThat(index(items, "delivery-attempt", "alert_id", CONFIRMED)).isGreaterThan(confirmAlert);
        assertThat(kind(items.get(items.size() - 1))).as("the acknowledgement came last").isEqualTo("ack");

        JsonNode then = json(given().get("/api/spreads/" + SPREAD + "/timeline?as_of=" + t1));
        assertThat(then.get("policy_hash").asText()).isEqualTo(originalHash);
        List<String> kinds = then.get("items").findValuesAsText("kind");
        assertThat(kinds.stream().filter("observation"::equals)).hasSize(UNTIL_T1);
        assertThat(kinds.stream().filter("transition"::equals)).hasSize(2);
        assertThat(kinds).doesNotContain("ack");
        then.get("items").forEach(i -> {
            if (kind(i).equals("transition")) {
                assertThat(i.get("superseded_by").isNull()).as("standing at T1").isTrue();
            }
        });
        JsonNode january = json(given().get("/api/spreads/" + SPREAD + "/timeline?from=2026-01-01&to=2026-01-31"));
        assertThat(january.get("items").findValuesAsText("date")).allMatch(d -> d.startsWith("2026-01"));
    }

    @Test
    @Order(5)
    void csvAndJsonExportsCarryTheSameRows() throws IOException {
        for (String what : List.of("observations", "transitions", "alerts")) {
            for (String asOf : new String[] {"", "&as_of=" + t1}) {
                String query = "/api/export/" + what + "?spread=" + SPREAD + asOf;
                Response csv = given().get(query + "&format=csv");
                csv.then().statusCode(200).contentType(containsString("text/csv"))
                        .header("Content-Disposition", containsString("attachment; filename=\"slopewatch-" + what + "-GOVT-A_10Y-3M"));
                Response json = given().get(query + "&format=json");
                json.then().statusCode(200).header("Content-Disposition", containsString(".json\""));
                List<CsvRecord> records = csv(csv.asString());
                JsonNode doc = JSON.readTree(json.asString());
                assertThat(doc.get("policy_hash").asText()).isEqualTo(asOf.isEmpty() ? reloadedHash : originalHash);
                assertThat(csv.header("X-Slopewatch-Policy-Hash")).isEqualTo(doc.get("policy_hash").asText());
                assertSameRows(what + asOf, records, doc.get("items"));
            }
        }
        List<CsvRecord> observations = csv(given().get("/api/export/observations?spread=" + SPREAD + "&as_of=" + t1).asString());
        assertThat(observations.get(0).getFields()).containsExactly("id", "spread_id", "market_date", "value_bp", "seq", "standing",
                "recorded_at");
        assertThat(observations.subList(1, observations.size())).as("every day at 480 − 500 bp, all standing at T1").hasSize(UNTIL_T1)
                .allSatisfy(r -> {
                    assertThat(Double.parseDouble(r.getField(3))).isEqualTo(-20.0);
                    assertThat(r.getField(5)).isEqualTo("true");
                });
        List<CsvRecord> transitions = csv(given().get("/api/export/transitions?spread=" + SPREAD).asString());
        assertThat(transitions).hasSize(5);
        assertThat(transitions.stream().skip(1).filter(r -> r.getField(14).isEmpty())).as("two standing, two superseded").hasSize(2);
        String alertsCsv = given().get("/api/export/alerts?spread=" + SPREAD).asString();
        assertThat(alertsCsv).as("a plain header row first, no comment").startsWith("id,rule,subject,episode_since,notice,kind,severity,");
        assertThat(alertsCsv).as("RFC 4180: a quote inside a field is doubled").contains("\"\"not yet persistent\"\"");
        given().get("/api/export/alerts?format=xml").then().statusCode(400);
    }

    // --- helpers ---

    private static List<LocalDate> businessDays(LocalDate from, LocalDate to) {
        List<LocalDate> days = new ArrayList<>();
        for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                days.add(d);
            }
        }
        return days;
    }

    /** Snapshots of 3M and 10Y on business days, 10Y − 3M = spreadBp. */
    private static String days(LocalDate from, LocalDate to, double spreadBp) {
        List<String> items = new ArrayList<>();
        for (LocalDate d : businessDays(from, to)) {
            items.add("{\"curve\":\"GOVT-A\",\"date\":\"" + d + "\",\"unit\":\"bp\",\"yields\":{\"3M\":500.0,\"10Y\":" + (500.0 + spreadBp) + "}}");
        }
        return "[" + String.join(",", items) + "]";
    }

    private static void post(String body) {
        given().contentType("application/json").body(body).post("/api/quotes").then().statusCode(200);
    }

    private static JsonNode json(Response r) throws IOException {
        assertThat(r.statusCode()).as(r.asString()).isEqualTo(200);
        return JSON.readTree(r.asString());
    }

    private static List<String> dates(JsonNode transitions) {
        return transitions.findValuesAsText("date");
    }

    private static String kind(JsonNode item) {
        return item.get("kind").asText();
    }

    private static int index(List<JsonNode> items, String kind, String field, String value) {
        for (int i = 0; i < items.size(); i++) {
            if (kind(items.get(i)).equals(kind) && value.equals(items.get(i).path(field).asText())) {
                return i;
            }
        }
        throw new AssertionError("no " + kind + " with " + field + "=" + value + " in the timeline");
    }

    private static int indexOfLast(List<JsonNode> items, String kind, String field, String value) {
        int found = -1;
        for (int i = 0; i < items.size(); i++) {
            if (kind(items.get(i)).equals(kind) && value.equals(items.get(i).path(field).asText())) {
                found = i;
            }
        }
        return found;
    }

    private static List<CsvRecord> csv(String text) throws IOException {
        try (CsvReader<CsvRecord> reader = CsvReader.builder().ofCsvRecord(text)) {
            return reader.stream().toList();
        }
    }

    /** The CSV header names the JSON items' fields in order, and each row holds the same values as text. */
    private static void assertSameRows(String what, List<CsvRecord> csv, JsonNode items) {
        List<String> header = csv.get(0).getFields();
        assertThat(csv.size() - 1).as("%s: as many rows as items", what).isEqualTo(items.size()).isPositive();
        for (int r = 0; r < items.size(); r++) {
            JsonNode item = items.get(r);
            List<String> names = new ArrayList<>();
            item.fieldNames().forEachRemaining(names::add);
            assertThat(names).as("%s: JSON fields = CSV header", what).isEqualTo(header);
            for (int c = 0; c < header.size(); c++) {
                JsonNode v = item.get(header.get(c));
                String cell = csv.get(r + 1).getField(c);
                if (v.isNull()) {
                    assertThat(cell).as("%s row %d %s", what, r, header.get(c)).isEmpty();
                } else if (v.isNumber()) {
                    assertThat(Double.parseDouble(cell)).as("%s row %d %s", what, r, header.get(c)).isEqualTo(v.asDouble());
                } else {
                    assertThat(cell).as("%s row %d %s", what, r, header.get(c)).isEqualTo(v.asText());
                }
            }
        }
    }

    private static String sha256(byte[] bytes) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }
}
