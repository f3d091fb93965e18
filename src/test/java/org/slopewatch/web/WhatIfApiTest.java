package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.matchesPattern;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.Test;

/**
 * The what-if over HTTP on a running daemon: quotes in, the shipped policy's notices journalled,
 * then a what-if with another policy as a background job, polled to the end, and the live
 * spreads and alerts exactly as they were before.
 *
 * <p>Sources of the expected dates: the shipped policy ({@code alert-rules/default.yaml}) confirms
 * 10Y−3M when a calendar quarter averages below 0 bp, on the first observation after the quarter
 * (or after 90 days inverted, which comes a day later here); the policy tried
 * ({@code policies/whatif-30-days.yaml}) confirms after 30 calendar days inverted. With GOVT-A
 * inverted by 20 bp on every business day from 2 January 2026, the shipped policy confirmed on
 * 1 April and the policy tried confirms on the first business day 30 days after 2 January.
 */
@QuarkusTest
@TestProfile(WhatIfApiTest.OwnJournal.class)
class WhatIfApiTest {

    private static final Duration PATIENCE = Duration.ofSeconds(60);
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final LocalDate SPELL = LocalDate.of(2026, 1, 2);
    private static final LocalDate LAST = LocalDate.of(2026, 4, 3);
    private static final LocalDate LIVE_CONFIRMED = LocalDate.of(2026, 4, 1);

    /** A journal of its own, and no clock-driven evaluation during the test: nothing may change but what the test does. */
    public static final class OwnJournal implements QuarkusTestProfile {
        @Override
        public Map<String, String> getConfigOverrides() {
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.data-dir", Path.of(".", "target", "test-data", "what-if-" + UUID.randomUUID().toString().substring(0, 8))
                    .toString());
            config.put("slopewatch.alerts.evaluate-every", "1h");
            config.put("slopewatch.alerts.delivery-poll", "100ms");
            return config;
        }
    }

    @Test
    void aWhatIfRunsInTheBackgroundAndLeavesLiveStateAsItWas() throws Exception {
        // one request per business day, as a daily feed sends them: the daemon evaluates its rules after each
        List<LocalDate> days = businessDays(SPELL, LAST);
        for (LocalDate d : days) {
            given().contentType("application/json").body("{\"curve\":\"GOVT-A\",\"date\":\"" + d + "\",\"unit\":\"bp\","
                    + "\"yields\":{\"3M\":500.0,\"10Y\":480.0}}").post("/api/quotes").then().statusCode(200);
        }
        Awaitility.await("the live notices delivered or skipped").atMost(PATIENCE).until(() -> {
            JsonNode alerts = get("/api/alerts?limit=1000");
            return alerts.get("recent").size() >= 2 && !alerts.findValuesAsText("status").contains("PENDING");
        });
        JsonNode spreadsBefore = get("/api/spreads");
        JsonNode alertsBefore = get("/api/alerts?limit=1000");
        assertThat(alertsBefore.get("recent").findValuesAsText("id")).as("what the shipped policy fired")
                .contains("first-inversion~GOVT-A:10Y-3M~" + SPELL + "~1", "inversion-confirmed~GOVT-A:10Y-3M~" + LIVE_CONFIRMED + "~1");

        byte[] policy = Files.readAllBytes(Path.of("src/test/resources/policies/whatif-30-days.yaml"));
        var started = given().contentType("application/json")
                .body(JSON.writeValueAsString(Map.of("policy", new String(policy, java.nio.charset.StandardCharsets.UTF_8),
                        "spreads", List.of("GOVT-A:10Y-3M"))))
                .post("/api/what-if").then().statusCode(202).body("state", equalTo("running"))
                .header("Location", matchesPattern(".*/api/what-if/[0-9a-f-]+$")).extract();
        String id = started.path("id");
        // RFC 9110, 15.3.3: a 202 ought to point to a monitor of the request's status; the API points with Location, to the job
        given().get(started.header("Location")).then().statusCode(200).body("id", equalTo(id));
        JsonNode job = awaitDone(id);

        assertThat(job.get("state").asText()).as(job.toString()).isEqualTo("done");
        assertThat(job.get("progress").get("done").asLong()).as("every journalled quote message taken").isEqualTo(days.size());
        assertThat(job.get("progress").get("total").asLong()).isEqualTo(days.size());
        JsonNode result = job.get("result");
        assertThat(result.get("policy_sha256").asText()).isEqualTo(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(policy)));
        assertThat(result.get("compared").asBoolean()).isTrue();
        assertThat(result.get("caution").asText()).contains("not investment advice");

        LocalDate triedConfirmed = firstOnOrAfter(days, SPELL.plusDays(30)); // 2026-02-01 is a Sunday
        assertThat(triedConfirmed).isEqualTo(LocalDate.of(2026, 2, 2));
        Map<String, JsonNode> rows = new LinkedHashMap<>();
        result.get("comparison").forEach(r -> rows.put(r.get("rule").asText(), r));
        assertThat(rows.keySet()).containsExactlyInAnyOrder("first-inversion", "inversion-confirmed");
        assertThat(rows.get("first-inversion").get("difference").asText()).isEqualTo("same");
        JsonNode confirmed = rows.get("inversion-confirmed");
        assertThat(confirmed.get("difference").asText()).isEqualTo("earlier");
        assertThat(confirmed.get("tried_market_date").asText()).isEqualTo(triedConfirmed.toString());
        assertThat(confirmed.get("live_market_date").asText()).isEqualTo(LIVE_CONFIRMED.toString());
        assertThat(confirmed.get("calendar_days").asLong()).isEqualTo(ChronoUnit.DAYS.between(triedConfirmed, LIVE_CONFIRMED)).isEqualTo(58);
        assertThat(confirmed.get("market_days").asLong())
                .isEqualTo(days.stream().filter(d -> d.isAfter(triedConfirmed) && !d.isAfter(LIVE_CONFIRMED)).count());
        assertThat(result.get("counts").get("same").asInt()).isEqualTo(1);
        assertThat(result.get("counts").get("earlier").asInt()).isEqualTo(1);

        // an uploaded history for GOVT-B: listed, compared with nothing, and never ingested
        String csv = "date,3M,10Y\n2026-01-02,5.00,4.80\n2026-01-05,5.00,4.80\n2026-02-02,5.00,4.80\n2026-02-03,5.00,4.90\n";
        String uploaded = given().contentType("application/json")
                .body(JSON.writeValueAsString(Map.of("policy", new String(policy, java.nio.charset.StandardCharsets.UTF_8),
                        "history", csv, "curve", "GOVT-B")))
                .post("/api/what-if").then().statusCode(202).extract().path("id");
        JsonNode fromFile = awaitDone(uploaded);
        assertThat(fromFile.get("progress").get("done").asLong()).isEqualTo(4);
        assertThat(fromFile.get("result").get("compared").asBoolean()).isFalse();
        assertThat(fromFile.get("result").get("would_fire").findValuesAsText("market_date")).containsExactly("2026-01-02", "2026-02-02");

        assertThat(get("/api/spreads")).as("live spreads unchanged").isEqualTo(spreadsBefore);
        assertThat(get("/api/alerts?limit=1000")).as("live alerts unchanged").isEqualTo(alertsBefore);
    }

    @Test
    void anInvalidPolicyIs400WithFileLineAndColumn() {
        given().contentType("application/json")
                .body("{\"policy\": \"watch:\\n  - spread: 10Y-3M\\n    confirm: [weekly-average]\\n\"}")
                .post("/api/what-if").then().statusCode(400)
                .body("problems", hasItem(matchesPattern("policy:3:\\d+: .*weekly-average.*")));
        given().contentType("application/json").body("{\"spreads\": [\"GOVT-A:10Y-3M\"]}").post("/api/what-if").then().statusCode(400);
        given().get("/api/what-if/no-such-job").then().statusCode(404);
    }

    private static JsonNode awaitDone(String id) throws IOException {
        Awaitility.await("what-if " + id + " finished").atMost(PATIENCE).pollInterval(Duration.ofMillis(100))
                .until(() -> !get("/api/what-if/" + id).get("state").asText().equals("running"));
        return get("/api/what-if/" + id);
    }

    private static JsonNode get(String path) throws IOException {
        return JSON.readTree(given().get(path).then().statusCode(200).extract().asString());
    }

    private static List<LocalDate> businessDays(LocalDate from, LocalDate to) {
        List<LocalDate> out = new ArrayList<>();
        for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                out.add(d);
            }
        }
        return out;
    }

    private static LocalDate firstOnOrAfter(List<LocalDate> days, LocalDate date) {
        return days.stream().filter(d -> !d.isBefore(date)).findFirst().orElseThrow();
    }
}
