package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.response.Response;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.slopewatch.monitor.InversionMonitor;
import org.slopewatch.monitor.Observation;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadTrack;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.spread.SpreadKey;

/**
 * {@code GET /api/spreads/{id}/spells} on a running daemon: the ended spells the journal holds,
 * their figures restated when a late value deepens one, and as they stood at an earlier moment.
 * The reference is the monitor of the same policy ({@code policies/history.yaml}: below 0 bp
 * enters, 5 observations at or above 5 bp end a spell) fed the same values in memory.
 */
@QuarkusTest
@TestProfile(SpellsApiTest.Spells.class)
class SpellsApiTest {

    private static final Path POLICY = Path.of("src/test/resources/policies/history.yaml");
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final SpreadKey KEY = new SpreadKey("GOVT-A", "10Y-3M");

    public static final class Spells implements QuarkusTestProfile {
        @Override
        public Map<String, String> getConfigOverrides() {
            return Map.of("slopewatch.data-dir", "./target/test-data/spells-" + UUID.randomUUID().toString().substring(0, 8),
                    "slopewatch.ingest.policy", POLICY.toString());
        }
    }

    @Test
    void endedSpellsWithTheirFiguresRestatedByALateValueAndAsTheyStoodBefore() throws Exception {
        SpreadTrack reference = new SpreadTrack(new InversionMonitor(
                PolicyParser.parse(POLICY.toString(), Files.readAllBytes(POLICY)).watches().get(0).rules()), KEY);
        List<String> quotes = new ArrayList<>();
        long seq = 0;
        // a week 10 bp below zero, then a week 10 bp above: the fifth value above ends the spell
        for (LocalDate d = LocalDate.of(2026, 3, 2); d.isBefore(LocalDate.of(2026, 3, 14)); d = d.plusDays(1)) {
            if (d.getDayOfWeek().getValue() < 6) {
                double spread = d.isBefore(LocalDate.of(2026, 3, 9)) ? -10 : 10;
                quotes.add(quote(d, spread));
                reference.record(new Observation(d, spread, ++seq));
            }
        }
        post("[" + String.join(",", quotes) + "]");
        assertThat(reference.endedSpells()).as("the reference ended one spell").hasSize(1);
        JsonNode before = json(given().get("/api/spreads/" + KEY.id() + "/spells"));
        assertSpells(before, reference.endedSpells());
        assertThat(before.get(0).get("deepest_bp").asDouble()).isEqualTo(-10.0);
        Instant t1 = Instant.now();

        // a late value deepens the ended spell's middle day and changes no transition
        post("[" + quote(LocalDate.of(2026, 3, 4), -30) + "]");
        reference.record(new Observation(LocalDate.of(2026, 3, 4), -30, ++seq));

        JsonNode after = json(given().get("/api/spreads/" + KEY.id() + "/spells"));
        assertSpells(after, reference.endedSpells());
        assertThat(after.get(0).get("deepest_bp").asDouble()).isEqualTo(-30.0);
        assertThat(after.get(0).get("deepest_date").asText()).isEqualTo("2026-03-04");
        assertThat(after.get(0).get("inverted_area_bp_days").asDouble())
                .isCloseTo(before.get(0).get("inverted_area_bp_days").asDouble() + 20, within(1e-6));

        JsonNode then = json(given().get("/api/spreads/" + KEY.id() + "/spells?as_of=" + t1));
        assertThat(then.get("as_of").asText()).isEqualTo(t1.toString());
        assertThat(then.get("spells")).as("as recorded by t1, recomputed").isEqualTo(before);

        given().get("/api/spreads/GOVT-Z:10Y-3M/spells").then().statusCode(404);
        given().get("/api/spreads/no-colon/spells").then().statusCode(400);
        given().get("/api/spreads/" + KEY.id() + "/spells?as_of=yesterday").then().statusCode(400);
    }

    private static void assertSpells(JsonNode answer, List<Spell> expected) {
        assertThat(answer.size()).isEqualTo(expected.size());
        for (int i = 0; i < expected.size(); i++) {
            JsonNode a = answer.get(i);
            Spell e = expected.get(i);
            assertThat(a.get("id").asLong()).isEqualTo(e.id());
            assertThat(a.get("start").asText()).isEqualTo(e.start().toString());
            assertThat(a.get("end").asText()).isEqualTo(e.end().toString());
            assertThat(a.get("duration_days").asLong()).isEqualTo(e.durationDays());
            assertThat(a.get("observations").asInt()).isEqualTo(e.observations());
            assertThat(a.get("deepest_bp").asDouble()).isCloseTo(e.deepestBp(), within(1e-6));
            assertThat(a.get("deepest_date").asText()).isEqualTo(e.deepestDate().toString());
            assertThat(a.get("inverted_area_bp_days").asDouble()).isCloseTo(e.invertedAreaBpDays(), within(1e-6));
        }
    }

    private static String quote(LocalDate d, double spreadBp) {
        return "{\"curve\":\"GOVT-A\",\"date\":\"" + d + "\",\"unit\":\"bp\",\"yields\":{\"3M\":500.0,\"10Y\":" + (500.0 + spreadBp) + "}}";
    }

    private static void post(String body) {
        given().contentType("application/json").body(body).post("/api/quotes").then().statusCode(200);
    }

    private static JsonNode json(Response r) throws IOException {
        assertThat(r.statusCode()).as(r.asString()).isEqualTo(200);
        return JSON.readTree(r.asString());
    }
}
