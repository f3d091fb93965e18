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
 * Quiet periods over HTTP: set with {@code lasts}, {@code note} and {@code set_by}, listed under
 * {@code quiet_periods}, lifted with {@code ?lifted_by=}; and {@code /api/mutes}, the old path with
 * its old fields, kept for one release with {@code Deprecation: true} and a {@code Link} to its
 * successor (vocabulary: deprecation path). Link relations: RFC 8288, with {@code successor-version} from RFC 5829;
 * {@code Deprecation: true} is the form of the IETF drafts, where RFC 9745 as published writes a date (from memory).
 */
@QuarkusTest
class QuietPeriodApiTest {

    @Test
    void aQuietPeriodIsSetListedAndLifted() {
        long id = given().contentType(ContentType.JSON)
                .body(Map.of("spread", "10Y-2Y", "lasts", "PT2H", "note", "feed vendor maintenance", "set_by", "ops"))
                .post("/api/quiet-periods").then().statusCode(201)
                .body("spread", equalTo("10Y-2Y")).body("rule", nullValue()).body("note", equalTo("feed vendor maintenance"))
                .body("set_by", equalTo("ops")).body("active", equalTo(true))
                .extract().jsonPath().getLong("id");
        List<Map<String, Object>> listed = given().get("/api/quiet-periods").then().statusCode(200).extract().jsonPath()
                .getList("quiet_periods");
        assertThat(listed).anySatisfy(q -> assertThat(((Number) q.get("id")).longValue()).isEqualTo(id));

        given().delete("/api/quiet-periods/" + id).then().statusCode(400).body("error", containsString("?lifted_by="));
        given().queryParam("lifted_by", "desk-lead").delete("/api/quiet-periods/" + id).then().statusCode(204);
        given().queryParam("lifted_by", "desk-lead").delete("/api/quiet-periods/" + id).then().statusCode(404);
        List<Map<String, Object>> after = given().get("/api/quiet-periods").then().extract().jsonPath().getList("quiet_periods");
        assertThat(after).filteredOn(q -> ((Number) q.get("id")).longValue() == id).singleElement()
                .satisfies(q -> assertThat(q).containsEntry("active", false).containsEntry("lifted_by", "desk-lead"));
    }

    @Test
    void theOldPathTakesTheOldFieldsAndSaysItIsDeprecated() {
        long id = given().contentType(ContentType.JSON)
                .body(Map.of("rule", "first-inversion", "duration", "PT1H", "reason", "drill", "by", "ops"))
                .post("/api/mutes").then().statusCode(201)
                .header("Deprecation", "true").header("Link", "</api/quiet-periods>; rel=\"successor-version\"")
                .body("kind", equalTo("rule")).body("target", equalTo("first-inversion")).body("reason", equalTo("drill"))
                .body("by", equalTo("ops"))
                .extract().jsonPath().getLong("id");
        // the same quiet period under its new name and fields
        List<Map<String, Object>> listed = given().get("/api/quiet-periods").then().extract().jsonPath().getList("quiet_periods");
        assertThat(listed).filteredOn(q -> ((Number) q.get("id")).longValue() == id).singleElement()
                .satisfies(q -> assertThat(q).containsEntry("rule", "first-inversion").containsEntry("note", "drill")
                        .containsEntry("set_by", "ops"));
        List<Map<String, Object>> old = given().get("/api/mutes").then().statusCode(200).header("Deprecation", "true")
                .extract().jsonPath().getList("$");
        assertThat(old).filteredOn(m -> ((Number) m.get("id")).longValue() == id).singleElement()
                .satisfies(m -> assertThat(m).containsEntry("kind", "rule").containsEntry("reason", "drill").containsEntry("active", true));
        given().contentType(ContentType.JSON).body(Map.of("rule", "no-such-rule", "duration", "PT1H", "reason", "x", "by", "ops"))
                .post("/api/mutes").then().statusCode(400).header("Deprecation", "true");
        given().queryParam("by", "ops").delete("/api/mutes/" + id).then().statusCode(204).header("Deprecation", "true");
    }
}
