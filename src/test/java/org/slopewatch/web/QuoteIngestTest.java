package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.hasSize;
import static org.hamcrest.Matchers.greaterThanOrEqualTo;
import static org.hamcrest.Matchers.startsWith;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import io.restassured.RestAssured;
import io.restassured.config.EncoderConfig;
import io.restassured.http.ContentType;
import io.restassured.specification.RequestSpecification;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
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
    void aCsvBodyThatCannotBeReadIsRefusedWholeAtItsLineAndColumnNeverWithAServerError() {
        // Expected positions from RFC 4180 section 2 (quoting) and RFC 3629 section 3 (UTF-8), columns counted by hand.
        // "2026-05-04,GOVT-A,10Y," is 22 characters: the quoted yield is at 23 to 27, the x at 28
        refusedCsv("text/csv", "date,curve,tenor,yield\n2026-05-04,GOVT-A,10Y,\"4.2\"x\n".getBytes(StandardCharsets.UTF_8),
                "request:2:28: text after the closing quote of a field: 'x'");
        // JSON sent as CSV: the first field is {"curve":"GOVT-A" (a quote inside an unquoted field is data, columns 1 to 17),
        // the second opens with the quote of "tenor" (19 to 25), which the colon at 26 follows
        refusedCsv("text/csv", "{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-05-04\",\"yield\":4.215}".getBytes(StandardCharsets.UTF_8),
                "request:1:26: text after the closing quote of a field: ':'");
        // Java reads "4.2\0" as 4.2: a NUL must not pass as white space
        refusedCsv("text/plain", "date,curve,tenor,yield\n2026-05-04,GOVT-A,10Y,4.2\0\n".getBytes(StandardCharsets.UTF_8),
                "request:2:26: control character U+0000");
        refusedCsv("text/csv", new byte[] {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1A, '\n', 0, 0, 0, 13}, "request:1:1: not UTF-8 text");
        // a file of 1,000 days whose day 500 (line 501) is broken: none of the 499 days before it is taken.
        // "2019-05-15,GOVT-B,10Y," is 22 characters; the quote at 23 is never closed ("" inside it is a quote, not its end)
        StringBuilder file = new StringBuilder("date,curve,tenor,yield\r\n");
        for (int day = 0; day < 1_000; day++) {
            file.append(LocalDate.of(2019, 1, 1).plusDays(day)).append(day == 499 ? ",GOVT-B,10Y,\"4.5\"\"\r\n" : ",GOVT-B,10Y,4.5\r\n");
        }
        refusedCsv("text/csv", file.toString().getBytes(StandardCharsets.UTF_8), "request:501:23: this quote opens a field that is never closed");
        given().get("/api/curves/GOVT-B/2019-01-01").then().statusCode(404);
    }

    @Test
    void aCsvBodyRefusedWholeIsCountedAndJournalledLikeMalformedJson() {
        double csvMalformed = rejected("csv", "malformed");
        double csvUnit = rejected("csv", "unknown-unit");
        double jsonMalformed = rejected("http", "malformed");
        refusedCsv("text/csv", "date,curve,tenor,yield\n2026-05-05,GOVT-A,10Y,4.4\n2026-05-04,GOVT-A,2Y,4.7\n".getBytes(StandardCharsets.UTF_8),
                "request:3:1: dates out of order: 2026-05-04 after 2026-05-05");
        refusedCsv("text/csv", new byte[0], "request:1:1: empty file");
        unlabelled().contentType("text/csv").queryParam("unit", "basis-points").body("date,curve,tenor,yield\n2026-05-04,GOVT-A,10Y,4.2\n")
                .post("/api/quotes").then().statusCode(400).body("processed", equalTo(true)).body("accepted", equalTo(0))
                .body("rejected", equalTo(1)).body("errors[0].reason", equalTo("unknown-unit"));
        given().contentType(ContentType.JSON).body("{\"curve\":\"GOVT-A\"").post("/api/quotes").then().statusCode(400)
                .body("processed", equalTo(true)).body("rejected", equalTo(1)).body("errors[0].reason", equalTo("malformed"));

        assertThat(rejected("csv", "malformed") - csvMalformed).as("CSV bodies refused whole, one reject each").isEqualTo(2.0);
        assertThat(rejected("csv", "unknown-unit") - csvUnit).as("a CSV body in an unknown unit").isEqualTo(1.0);
        assertThat(rejected("http", "malformed") - jsonMalformed).as("malformed JSON").isEqualTo(1.0);
        List<Map<String, Object>> journal = given().get("/api/rejects?limit=20").then().statusCode(200).extract().jsonPath().getList("$");
        List<String> newest = journal.subList(0, 4).stream().map(r -> r.get("origin") + " " + r.get("reason") + " " + r.get("detail")).toList();
        List<String> expected = List.of("http malformed not valid JSON: ", "csv unknown-unit unknown yield unit 'basis-points'",
                "csv malformed request:1:1: empty file", "csv malformed request:3:1: dates out of order");
        for (int i = 0; i < expected.size(); i++) {
            assertThat(newest.get(i)).as("journalled reject %d, newest first", i).startsWith(expected.get(i));
        }
    }

    @Test
    void csvAsSpreadsheetsAndOtherSystemsWriteItIsRead() {
        // GOVT-B days in June 2026, before the July days ReportResourceTest builds its spell on; 10Y-3M +50 bp, no spell
        // RFC 3629 section 6: a byte-order mark EF BB BF, as spreadsheets save UTF-8; RFC 4180 section 2: CR LF line ends
        unlabelled().contentType("text/csv").body("\uFEFFdate,3M,10Y\r\n2026-06-01,4.00,4.50\r\n".getBytes(StandardCharsets.UTF_8))
                .queryParam("curve", "GOVT-B").post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        unlabelled().contentType("text/plain").body("date,curve,tenor,yield\n2026-06-02,GOVT-B,3M,4.00\n2026-06-02,GOVT-B,10Y,4.50\n")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        // a Latin-1 body read as what the content type says it is; the same bytes unlabelled are not UTF-8 (E9 then a comma)
        byte[] latin1 = "date,curve,tenor,yield,note\n2026-06-03,GOVT-B,10Y,4.50,caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1);
        given().contentType("text/csv; charset=ISO-8859-1").body(latin1).post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        refusedCsv("text/csv", latin1, "request:2:31: not UTF-8 text: the byte 0xE9");
        given().contentType("text/csv; charset=no-such-charset").body(latin1).post("/api/quotes").then().statusCode(400)
                .body("errors[0].detail", containsString("unknown charset 'no-such-charset'"));
        given().get("/api/curves/GOVT-B/2026-06-01").then().statusCode(200).body("yields_bp.'10Y'", equalTo(450.0f));
        given().get("/api/curves/GOVT-B/2026-06-03").then().statusCode(200).body("yields_bp.'10Y'", equalTo(450.0f));
        // a header and nothing else carries no quote: refused where the rows should begin
        refusedCsv("text/csv", "date,3M,10Y\n".getBytes(StandardCharsets.UTF_8), "request:2:1: no quotes: nothing follows the header");
        refusedCsv("text/csv", new byte[0], "request:1:1: empty file");
    }

    @Test
    void aPublishersFileThatCannotBeReadIsRefusedWholeAtItsLineAndColumn() {
        // Layouts as HistoryCsvReaderTreasuryTest, HistoryCsvReaderH15Test and HistoryCsvReaderSdmxTest document them (from memory).
        // Treasury par yields, newest first, the second row's date twice: nothing of the first row is taken either
        unlabelled().contentType("text/csv").queryParam("curve", "GOVT-A")
                .body("Date,\"3 Mo\",\"10 Yr\"\n11/03/2026,4.2,4.1\n11/03/2026,4.2,4.1\n").post("/api/quotes").then().statusCode(400)
                .body("accepted", equalTo(0)).body("errors[0].reason", equalTo("malformed"))
                .body("errors[0].detail", equalTo("request:3:1: date 2026-11-03 appears twice"));
        given().get("/api/curves/GOVT-A/2026-11-03").then().statusCode(404);
        // H.15 cut short before its Time Period header
        refusedCsv("text/csv", "\"Series Description\",\"10-year\"\n\"Unit:\",\"Percent:_Per_Year\"\n".getBytes(StandardCharsets.UTF_8),
                "request:3:1: the H.15 file ends before its 'Time Period' header");
        // SDMX-CSV with no series map configured
        refusedCsv("text/csv", "DATAFLOW,FREQ,TIME_PERIOD,OBS_VALUE\nDESK:YIELDS(1.0),D,2026-11-03,4.3\n".getBytes(StandardCharsets.UTF_8),
                "request:1:1: an SDMX-CSV file needs a series map");
    }

    /**
     * A request as curl and most clients send it: REST Assured adds {@code charset=ISO-8859-1} to a text content type
     * that names none, and a named charset is how the body is read.
     */
    private static RequestSpecification unlabelled() {
        return given().config(RestAssured.config().encoderConfig(EncoderConfig.encoderConfig()
                .appendDefaultContentCharsetToContentTypeIfUndefined(false)));
    }

    private static void refusedCsv(String contentType, byte[] body, String detail) {
        unlabelled().contentType(contentType).body(body).post("/api/quotes").then().statusCode(400)
                .body("processed", equalTo(true)).body("accepted", equalTo(0)).body("rejected", equalTo(1))
                .body("errors[0].reason", equalTo("malformed")).body("errors[0].detail", startsWith(detail));
    }

    /** A Prometheus counter of rejects, 0 when it has no line. */
    private static double rejected(String origin, String reason) {
        return given().get("/q/metrics").then().statusCode(200).extract().asString().lines()
                .filter(l -> l.startsWith("slopewatch_quotes_rejected_total{") && l.contains("origin=\"" + origin + "\"")
                        && l.contains("reason=\"" + reason + "\""))
                .mapToDouble(l -> Double.parseDouble(l.substring(l.lastIndexOf(' ') + 1))).sum();
    }

    @Test
    void theOpenApiDocumentAndHealthAreServed() {
        given().get("/q/openapi").then().statusCode(200).body(containsString("/api/quotes"));
        given().get("/q/health/ready").then().statusCode(200).body(containsString("journal"));
    }
}
