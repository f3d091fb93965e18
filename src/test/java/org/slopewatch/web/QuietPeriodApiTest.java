package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.nullValue;

import io.quarkus.test.junit.QuarkusTest;
import io.restassured.http.ContentType;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Quiet periods over HTTP: set with {@code lasts}, {@code note} and {@code set_by}, listed newest
 * first, lifted with {@code ?lifted_by=}; and {@code /api/mutes}, the old path with its old fields,
 * kept for one release: every answer, problems included, carries {@code Deprecation} and a
 * {@code Link} to its successor (vocabulary: deprecation path). Link relations: RFC 8288, with
 * {@code successor-version} from RFC 5829; the {@code Deprecation} field is RFC 9745's, a
 * structured-field date ({@code @} and seconds since the epoch, RFC 9651 section 3.3.7).
 */
@QuarkusTest
class QuietPeriodApiTest {

    /** 2026-12-05T00:00:00Z, when the old path was deprecated, in RFC 9745's form. */
    private static final String DEPRECATED_SINCE = "@" + java.time.Instant.parse("2026-12-05T00:00:00Z").getEpochSecond();

    @Test
    void aQuietPeriodIsSetListedAndLifted() {
        long id = given().contentType(ContentType.JSON)
                .body(Map.of("spread", "10Y-2Y", "lasts", "PT2H", "note", "feed vendor maintenance", "set_by", "ops"))
                .post("/api/quiet-periods").then().statusCode(201)
                .body("spread", equalTo("10Y-2Y")).body("rule", nullValue()).body("note", equalTo("feed vendor maintenance"))
                .body("set_by", equalTo("ops")).body("active", equalTo(true))
                .extract().jsonPath().getLong("id");
        List<Map<String, Object>> listed = given().get("/api/quiet-periods").then().statusCode(200).extract().jsonPath()
                .getList("$");
        assertThat(listed).anySatisfy(q -> assertThat(((Number) q.get("id")).longValue()).isEqualTo(id));

        given().delete("/api/quiet-periods/" + id).then().statusCode(400).body("detail", containsString("?lifted_by="));
        given().queryParam("lifted_by", "desk-lead").delete("/api/quiet-periods/" + id).then().statusCode(204);
        given().queryParam("lifted_by", "desk-lead").delete("/api/quiet-periods/" + id).then().statusCode(404);
        List<Map<String, Object>> after = given().get("/api/quiet-periods").then().extract().jsonPath().getList("$");
        assertThat(after).filteredOn(q -> ((Number) q.get("id")).longValue() == id).singleElement()
                .satisfies(q -> assertThat(q).containsEntry("active", false).containsEntry("lifted_by", "desk-lead"));
    }

    @Test
    void theOldPathTakesTheOldFieldsAndSaysItIsDeprecated() {
        long id = given().contentType(ContentType.JSON)
                .body(Map.of("rule", "first-inversion", "duration", "PT1H", "reason", "drill", "by", "ops"))
                .post("/api/mutes").then().statusCode(201)
                .header("Deprecation", DEPRECATED_SINCE).header("Link", "</api/quiet-periods>; rel=\"successor-version\"")
                .body("kind", equalTo("rule")).body("target", equalTo("first-inversion")).body("reason", equalTo("drill"))
                .body("by", equalTo("ops"))
                .extract().jsonPath().getLong("id");
        // the same quiet period under its new name and fields
        List<Map<String, Object>> listed = given().get("/api/quiet-periods").then().extract().jsonPath().getList("$");
        assertThat(listed).filteredOn(q -> ((Number) q.get("id")).longValue() == id).singleElement()
                .satisfies(q -> assertThat(q).containsEntry("rule", "first-inversion").containsEntry("note", "drill")
                        .containsEntry("set_by", "ops"));
        List<Map<String, Object>> old = given().get("/api/mutes").then().statusCode(200).header("Deprecation", DEPRECATED_SINCE)
                .extract().jsonPath().getList("$");
        assertThat(old).filteredOn(m -> ((Number) m.get("id")).longValue() == id).singleElement()
                .satisfies(m -> assertThat(m).containsEntry("kind", "rule").containsEntry("reason", "drill").containsEntry("active", true));
        given().contentType(ContentType.JSON).body(Map.of("rule", "no-such-rule", "duration", "PT1H", "reason", "x", "by", "ops"))
                .post("/api/mutes").then().statusCode(400).contentType("application/problem+json")
                .header("Deprecation", DEPRECATED_SINCE).body("detail", containsString("no-such-rule"));
        // a page of the old list: the successor and the next page, each its own Link (RFC 8288, section 3)
        List<String> links = given().get("/api/mutes?limit=1").then().statusCode(200).extract().headers().getValues("Link");
        assertThat(links).contains("</api/quiet-periods>; rel=\"successor-version\"").anyMatch(l -> l.endsWith("rel=\"next\""));
        given().queryParam("by", "ops").delete("/api/mutes/" + id).then().statusCode(204).header("Deprecation", DEPRECATED_SINCE);
    }
}
