package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.equalTo;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.http.ContentType;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The read API writes yields, spreads and averages as the decimals the quotes make, never a binary
 * residue such as {@code -40.00000000000006} (4.10 % − 4.50 % as doubles) or {@code 93.80000000000001}
 * (4.718 % − 3.78 %).
 *
 * <p>Reference: decimal arithmetic, {@link BigDecimal} on the quoted decimal strings: each number the
 * answer writes is read as a BigDecimal from the answer's own text and must equal the value worked
 * out from the quotes.
 */
@QuarkusTest
@TestProfile(ValuesAtResolutionTest.OwnJournal.class)
class ValuesAtResolutionTest {

    /** A journal of its own: the test reads where GOVT-A stands now, which no other test's quotes may move. */
    public static final class OwnJournal implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            return Map.of("slopewatch.data-dir", Path.of("target", "test-data", "resolution-" + UUID.randomUUID()).toAbsolutePath().toString());
        }
    }

    /** Any JSON number with its field name. */
    private static final Pattern NUMBER = Pattern.compile("\"([A-Za-z0-9_]+)\":(-?[0-9][0-9.eE+-]*)");

    @Test
    void spreadsYieldsAndAveragesAreWrittenAsTheirDecimals() {
        // invented GOVT-A days: 10Y-3M is 4.10 - 4.50 = -40 bp, then 4.718 - 3.78 = +93.8 bp
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-A","date":"2026-03-02","yields":{"3M":4.50,"2Y":4.30,"10Y":4.10}},
                 {"curve":"GOVT-A","date":"2026-03-03","yields":{"3M":3.78,"2Y":4.15,"10Y":4.718}}]""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(2)).body("processed", equalTo(true));

        BigDecimal first = bp("4.10", "4.50");
        BigDecimal second = bp("4.718", "3.78");
        BigDecimal average = first.add(second).divide(BigDecimal.valueOf(2), MathContext.DECIMAL128);
        assertThat(average).isEqualByComparingTo("26.9");

        String history = given().get("/api/spreads/GOVT-A:10Y-3M/history?from=2026-03-02&to=2026-03-03").then().statusCode(200)
                .extract().asString();
        assertThat(numbers(history, "value_bp")).as(history).usingElementComparator(BigDecimal::compareTo).containsExactly(first, second);

        String spread = given().get("/api/spreads/GOVT-A:10Y-3M").then().statusCode(200).extract().asString();
        assertThat(numbers(spread, "value_bp")).as(spread).usingElementComparator(BigDecimal::compareTo).containsExactly(second);
        assertThat(numbers(spread, "quarter_to_date_average_bp")).as(spread).usingElementComparator(BigDecimal::compareTo)
                .containsExactly(average);
        // the month so far, March, averages the same two days (the default policy has a model for 10Y-3M)
        assertThat(numbers(spread, "month_average_bp")).as(spread).usingElementComparator(BigDecimal::compareTo).containsExactly(average);
        assertSixDecimalsAtMost(spread);

        String list = given().get("/api/spreads").then().statusCode(200).extract().asString();
        assertThat(list).contains("\"value_bp\":93.8,").contains("\"deepest_bp\":-40.0,");
        assertSixDecimalsAtMost(list);

        String curve = given().get("/api/curves/GOVT-A/2026-03-03").then().statusCode(200).extract().asString();
        // each yield in bp: the quoted percent × 100, exactly (4.15 × 100 computes as 415.00000000000006)
        assertThat(numbers(curve, "3M")).usingElementComparator(BigDecimal::compareTo).containsExactly(new BigDecimal("3.78").movePointRight(2));
        assertThat(numbers(curve, "2Y")).usingElementComparator(BigDecimal::compareTo).containsExactly(new BigDecimal("4.15").movePointRight(2));
        assertThat(numbers(curve, "10Y")).usingElementComparator(BigDecimal::compareTo).containsExactly(new BigDecimal("4.718").movePointRight(2));
        assertSixDecimalsAtMost(curve);
    }

    /** (long − short) × 100, exactly. */
    private static BigDecimal bp(String longLeg, String shortLeg) {
        return new BigDecimal(longLeg).subtract(new BigDecimal(shortLeg)).movePointRight(2);
    }

    /** Every number the answer writes under {@code field}, read as a decimal from the answer's text. */
    private static List<BigDecimal> numbers(String json, String field) {
        List<BigDecimal> out = new ArrayList<>();
        Matcher m = NUMBER.matcher(json);
        while (m.find()) {
            if (m.group(1).equals(field)) {
                out.add(new BigDecimal(m.group(2)));
            }
        }
        return out;
    }

    /** No number in the answer carries more than six decimals (the resolution of basis points and probabilities). */
    private static void assertSixDecimalsAtMost(String json) {
        Matcher m = NUMBER.matcher(json);
        while (m.find()) {
            assertThat(new BigDecimal(m.group(2)).stripTrailingZeros().scale()).as("%s = %s", m.group(1), m.group(2)).isLessThanOrEqualTo(6);
        }
    }
}
