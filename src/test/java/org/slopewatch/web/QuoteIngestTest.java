package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.hasSize;
import static org.hamcrest.Matchers.greaterThanOrEqualTo;

import io.quarkus.test.junit.QuarkusTest;
import io.restassured.http.ContentType;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;

/** The HTTP ingest and the read API on the embedded defaults: what is accepted, what is not, and why. */
@QuarkusTest
class QuoteIngestTest {

    @Test
    void aSingleQuoteASnapshotAndAnArrayAreAccepted() {
        given().contentType(ContentType.JSON).body("""
                {"curve":"GOVT-A","tenor":"10Y","date":"2026-03-02","yield":4.215,"id":"single-1"}""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1)).body("processed", equalTo(true));
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-A","date":"2026-03-02","yields":{"3M":5.10,"2Y":4.60}},
                 {"curve":"GOVT-B","date":"2026-03-02","yields":{"3M":3.10,"2Y":3.40,"10Y":4.40},"unit":"percent"}]""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(2)).body("rejected", equalTo(0));
        given().get("/api/curves/GOVT-A/2026-03-02").then().statusCode(200).body("yields_bp.'10Y'", equalTo(421.5f));
        given().get("/api/curves").then().statusCode(200).body("curve", hasItem("GOVT-A"));
        given().get("/api/spreads/GOVT-A:10Y-3M/history?from=2026-03-02&to=2026-03-02").then().statusCode(200)
                .body("value_bp", equalTo(java.util.List.of(-88.5f)));
        given().get("/api/spreads/GOVT-A:10Y-3M").then().statusCode(200).body("state_code", org.hamcrest.Matchers.greaterThan(0));
        given().get("/api/transitions?spread=GOVT-A:10Y-3M&from=2026-03-02&to=2026-03-02").then().statusCode(200)
                .body("to", hasItem("INVERTED")).body("reason", hasItem("spread -88.5 bp below entry threshold 0 bp"));
    }

    @Test
    void aRepeatedIdIsADuplicate() {
        String body = """
                {"curve":"GOVT-B","tenor":"10Y","date":"2026-02-02","yield":4.1,"id":"dup-7"}""";
        given().contentType(ContentType.JSON).body(body).post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        given().contentType(ContentType.JSON).body(body).post("/api/quotes").then().statusCode(200)
                .body("accepted", equalTo(0)).body("duplicates", equalTo(1));
    }

    @Test
    void badItemsAreRejectedWithReasonsWhileGoodOnesGoThrough() {
        String future = LocalDate.now().plusDays(30).toString();
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-A","tenor":"2Y","date":"2026-01-05","yield":4.5},
                 {"curve":"GOVT-Z","tenor":"2Y","date":"2026-01-05","yield":4.5},
                 {"curve":"GOVT-A","tenor":"7Q","date":"2026-01-05","yield":4.5},
                 {"curve":"GOVT-A","tenor":"2Y","date":"2026-01-05","yield":NaN},
                 {"curve":"GOVT-A","tenor":"2Y","date":"2026-01-05","yield":450},
                 {"curve":"GOVT-A","tenor":"2Y","date":"%s","yield":4.5},
                 {"curve":"GOVT-A","tenor":"2Y","date":"2026-01-05","yeild":4.5}]""".formatted(future))
                .post("/api/quotes").then().statusCode(200)
                .body("accepted", equalTo(1)).body("rejected", equalTo(6))
                .body("errors.reason", equalTo(java.util.List.of("unknown-curve", "unknown-tenor", "not-finite", "implausible",
                        "future-date", "malformed")))
                .body("errors[0].item", equalTo(1)).body("errors[0].detail", equalTo("unknown curve 'GOVT-Z'"))
                .body("errors[3].detail", containsString("check the unit"));
        given().get("/api/rejects?limit=50").then().statusCode(200).body("reason", hasItem("unknown-tenor"))
                .body("detail", hasItem("unknown field 'yeild'"));
    }

    @Test
    void nothingAcceptedIs400WithTheErrorsSpelledOut() {
        given().contentType(ContentType.JSON).body("{\"curve\":\"GOVT-A\"").post("/api/quotes").then().statusCode(400)
                .body("accepted", equalTo(0)).body("errors[0].reason", equalTo("malformed"))
                .body("errors[0].detail", containsString("not valid JSON"));
        given().contentType(ContentType.JSON).body("[{\"curve\":\"GOVT-A\",\"tenor\":\"2Y\",\"date\":\"2026-01-05\"}]")
                .post("/api/quotes").then().statusCode(400).body("errors[0].reason", equalTo("missing-field"))
                .body("errors[0].detail", equalTo("missing field 'yield'"));
    }

    @Test
    void billsQuotedOnADiscountBasisAreConvertedFirst() {
        // 13-week (91-day) bill at 5.00 % discount: 365·0.05 / (360 − 0.05·91) = 5.1343 % bond-equivalent (U.S. Treasury formula)
        given().contentType(ContentType.JSON).body("""
                {"curve":"GOVT-B","tenor":"13W","date":"2026-01-06","yield":5.00,"basis":"discount"}""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        float bey = given().get("/api/curves/GOVT-B/2026-01-06").then().statusCode(200).extract().path("yields_bp.'13W'");
        org.assertj.core.api.Assertions.assertThat((double) bey).isCloseTo(513.43, org.assertj.core.data.Offset.offset(0.01));
    }

    @Test
    void csvInTheReplayLayoutsIsAccepted() {
        given().contentType("text/csv").body("date,3M,2Y,10Y\n2026-04-01,5.0,4.7,4.6\n2026-04-02,5.0,4.7,4.5\n")
                .queryParam("curve", "GOVT-A").post("/api/quotes").then().statusCode(200).body("accepted", equalTo(2));
        given().contentType("text/csv").body("date,curve,tenor,yield\n2026-04-03,GOVT-A,10Y,4.4\n2026-04-01,GOVT-A,2Y,4.7\n")
                .post("/api/quotes").then().statusCode(400)
                .body("errors[0].detail", equalTo("request:3:1: dates out of order: 2026-04-01 after 2026-04-03"));
        given().get("/api/spreads/GOVT-A:10Y-2Y/history?from=2026-04-01&to=2026-04-02").then().statusCode(200)
                .body("", hasSize(2)).body("value_bp", equalTo(java.util.List.of(-10.0f, -20.0f)));
        given().get("/api/transitions?spread=GOVT-A:10Y-2Y").then().statusCode(200).body("size()", greaterThanOrEqualTo(1));
    }

    @Test
    void theOpenApiDocumentAndHealthAreServed() {
        given().get("/q/openapi").then().statusCode(200).body(containsString("/api/quotes"));
        given().get("/q/health/ready").then().statusCode(200).body(containsString("journal"));
    }
}
