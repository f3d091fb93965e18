package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.http.ContentType;
import jakarta.inject.Inject;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Test;
import org.slopewatch.alerting.PolicyHolder;

/** {@code GET /api/report}: the journal's story of a spread as one HTML page, read back with jsoup. */
@QuarkusTest
@TestProfile(ReportResourceTest.OwnJournal.class)
class ReportResourceTest {

    /**
     * A journal of its own: the report states where GOVT-B stands at the end of its journal, so no
     * other test's GOVT-B quotes may come after the days posted here.
     */
    public static final class OwnJournal implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            return Map.of("slopewatch.data-dir", java.nio.file.Path.of("target", "test-data", "report-" + java.util.UUID.randomUUID())
                    .toAbsolutePath().toString());
        }
    }

    private static final String SPREAD = "GOVT-B:10Y-3M";

    @Inject
    PolicyHolder policies;

    @Test
    void theReportOfAJournalledSpreadHasItsChartSpellAndThePolicyInForce() throws Exception {
        // Invented GOVT-B days (July 2026, after every other test's GOVT-B dates): six days at +20 bp end any spell
        // other tests left open (the default policy ends a spell after 5 observations at or above 5 bp), then
        // 10Y falls below 3M: 4.80 - 5.00 = -20 bp on 2026-07-09, -25 bp, -30 bp.
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-B","date":"2026-07-01","yields":{"3M":5.00,"2Y":5.05,"10Y":5.20}},
                 {"curve":"GOVT-B","date":"2026-07-02","yields":{"3M":5.00,"2Y":5.05,"10Y":5.20}},
                 {"curve":"GOVT-B","date":"2026-07-03","yields":{"3M":5.00,"2Y":5.05,"10Y":5.20}},
                 {"curve":"GOVT-B","date":"2026-07-06","yields":{"3M":5.00,"2Y":5.05,"10Y":5.20}},
                 {"curve":"GOVT-B","date":"2026-07-07","yields":{"3M":5.00,"2Y":5.05,"10Y":5.20}},
                 {"curve":"GOVT-B","date":"2026-07-08","yields":{"3M":5.00,"2Y":5.05,"10Y":5.20}},
                 {"curve":"GOVT-B","date":"2026-07-09","yields":{"3M":5.00,"2Y":4.95,"10Y":4.80}},
                 {"curve":"GOVT-B","date":"2026-07-10","yields":{"3M":5.00,"2Y":4.95,"10Y":4.75}},
                 {"curve":"GOVT-B","date":"2026-07-13","yields":{"3M":5.00,"2Y":4.95,"10Y":4.70}}]""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(9)).body("processed", equalTo(true));

        String html = given().queryParam("spread", SPREAD).get("/api/report").then().statusCode(200)
                .contentType(containsString("text/html")).extract().asString();
        Document page = Jsoup.parse(html);

        Element section = page.selectFirst("section.spread[data-spread=" + SPREAD + "]");
        assertThat(section).as("a section for %s", SPREAD).isNotNull();
        Element svg = section.selectFirst("svg.chart");
        assertThat(svg).as("a chart").isNotNull();
        // the chart spans the journalled range of the spread, which other tests of this shared daemon may widen:
        // it must cover the days posted here (2026-07-01 to 2026-07-13)
        String title = svg.selectFirst("> title").text();
        java.util.regex.Matcher range = java.util.regex.Pattern.compile("(\\d{4}-\\d{2}-\\d{2}) to (\\d{4}-\\d{2}-\\d{2})").matcher(title);
        assertThat(title).contains(SPREAD);
        assertThat(range.find()).as(title).isTrue();
        assertThat(java.time.LocalDate.parse(range.group(1))).as(title).isBeforeOrEqualTo(java.time.LocalDate.parse("2026-07-01"));
        assertThat(java.time.LocalDate.parse(range.group(2))).as(title).isAfterOrEqualTo(java.time.LocalDate.parse("2026-07-13"));
        assertThat(svg.select("g.spread-line path")).isNotEmpty();
        assertThat(svg.select("g.zero-line")).hasSize(1);

        // the spell the posted days opened, read off the journal's transitions, is shaded and still open
        Elements spells = svg.select("g.spell");
        assertThat(spells).isNotEmpty();
        assertThat(spells.last().attr("data-start")).isEqualTo("2026-07-09");
        assertThat(spells.last().attr("data-end")).isEqualTo("open");
        List<List<String>> rows = section.select("table.transitions tbody tr").stream().map(r -> r.select("td").eachText()).toList();
        assertThat(rows).anySatisfy(r -> assertThat(r.subList(0, 5)).containsExactly("2026-07-09", r.get(1), "INVERTED", "entry", "-20.0 bp"));
        assertThat(section.selectFirst("p.summary").text()).contains("INVERTED on 2026-07-13 at -30.0 bp");

        // the policy in force: its file, the SHA-256 of that file's bytes computed here, and its rules for 10Y-3M
        PolicyHolder.Loaded inForce = policies.current();
        String sha256 = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                .digest(Files.readAllBytes(Path.of(inForce.source()))));
        assertThat(page.select(".policy-file").text()).isEqualTo(inForce.source());
        assertThat(page.select(".policy-hash").text()).isEqualTo(sha256).isEqualTo(inForce.hash());
        // alert-rules/default.yaml: 10Y-3M is confirmed by a quarter averaging below 0 bp or 90 days inverted
        assertThat(page.select("table.rules tbody tr").stream().map(r -> r.select("th, td").eachText()).toList())
                .anySatisfy(r -> assertThat(r).containsExactly("10Y-3M", "all", "0 bp", "5 bp", "5", "365 days",
                        "quarter-average < 0 bp or days-inverted >= 90 d"));

        assertThat(page.select(".caution").text()).contains("not investment advice");
        assertThat(html).doesNotContain("src=\"http").doesNotContain("<link").doesNotContain("<script");
        assertThat(page.select("table.leads")).as("the daemon has no recession dates").isEmpty();

        // The page opens with its findings: where the spread stands now and, under the default policy's
        // probit for 10Y-3M (Estrella and Trubin (2006), alpha -0.5333, beta -0.6330, twelve months ahead,
        // from memory), the probability from July 2026 so far: the nine posted days average
        // (6 x 20 - 20 - 25 - 30) / 9 = 5 bp = 0.05 pp, P = Phi(-0.5333 - 0.6330 x 0.05), Phi from Commons Math.
        assertThat(page.selectFirst("main > *").is("section.findings")).as("the findings come first").isTrue();
        Element findings = page.selectFirst("section.findings div.spread-findings[data-spread=" + SPREAD + "]");
        assertThat(findings.selectFirst("dd.state-now").text())
                .isEqualTo("INVERTED since 2026-07-09; -30.0 bp on 2026-07-13; inverted spell open since 2026-07-09, not confirmed");
        double p = new NormalDistribution().cumulativeProbability(-0.5333 - 0.6330 * 0.05);
        assertThat(findings.selectFirst("dd.probability.provisional").text())
                .startsWith(String.format(Locale.ROOT, "12-month-ahead recession probability %.0f %% (no band", 100 * p))
                .contains("P(recession in 2027-07), from the 10Y-3M average of 2026-07 so far (provisional: month to date, 9 observations)")
                .contains("; model: Estrella and Trubin (2006)");
    }

    @Test
    void aMissingUnknownOrMalformedSpreadIsRefused() {
        given().get("/api/report").then().statusCode(400);
        given().queryParam("spread", "10Y-3M").get("/api/report").then().statusCode(400);
        given().queryParam("spread", "GOVT-B:30Y-7Y").get("/api/report").then().statusCode(404);
    }
}
