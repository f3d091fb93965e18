package org.slopewatch.ops;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;

/**
 * What {@code /q/metrics} says of the spreads and the build, read as Prometheus text: one series
 * per state with 1 on the state a spread is in, histogram buckets on the step timers, an info
 * series naming the version in pom.xml and the SHA-256 of the policy file (computed here with the
 * JDK), and no series left for a spread the policy stopped watching after a reload.
 */
@QuarkusTest
@TestProfile(PipelineMetricsTest.OwnPolicy.class)
class PipelineMetricsTest {

    static final Path POLICY = Path.of("target", "test-data", "metrics-" + UUID.randomUUID(), "policy.yaml").toAbsolutePath();

    /** A policy file of its own, so that the test may change it and reload. */
    public static final class OwnPolicy implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            try {
                Files.createDirectories(POLICY.getParent());
                Files.copy(Path.of("alert-rules/default.yaml"), POLICY, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            } catch (java.io.IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            return Map.of("slopewatch.ingest.policy", POLICY.toString(),
                    "slopewatch.data-dir", POLICY.getParent().resolve("data").toString());
        }
    }

    /** Before anything happened, every series the policy can move is there at zero. */
    @Test
    void alertCountersExistAtZeroFromTheStart() throws Exception {
        List<String> metrics = metrics();
        // the rule names and severities as written in the policy file, read here with a plain pattern
        java.util.regex.Matcher rule = java.util.regex.Pattern.compile("- name: (\\S+)\\n(?:.*\\n)*?\\s+severity: (\\w+)")
                .matcher(Files.readString(Path.of("alert-rules/default.yaml")));
        int rules = 0;
        while (rule.find()) {
            rules++;
            String name = rule.group(1);
            String severity = rule.group(2);
            for (String kind : java.util.Arrays.stream(org.slopewatch.rules.Alert.Kind.values())
                    .map(k -> k.name().toLowerCase(java.util.Locale.ROOT)).toList()) {
                assertThat(metrics).as("notices of %s, %s", name, kind).contains("slopewatch_alerts_total{kind=\"" + kind
                        + "\",muted=\"true\",rule=\"" + name + "\",severity=\"" + severity + "\"} 0.0");
            }
            assertThat(metrics).contains("slopewatch_alert_attempts_total{channel=\"log\",outcome=\"failed\",rule=\"" + name
                    + "\",severity=\"" + severity + "\"} 0.0");
        }
        assertThat(rules).as("rules found in the shipped policy").isEqualTo(4);
        assertThat(metrics).contains("slopewatch_alert_deliveries_total{channel=\"risk-email\",outcome=\"failed\"} 0.0",
                "slopewatch_alert_deliveries_total{channel=\"log\",outcome=\"skipped\"} 0.0",
                "slopewatch_policy_reloads_total{outcome=\"rejected\"} 0.0");
    }

    @Test
    void spreadsStatesBuildAndPolicyAreExportedAndDroppedSpreadsGo() throws Exception {
        for (int day = 2; day <= 6; day++) {
            given().contentType("application/json")
                    .body("{\"curve\":\"GOVT-A\",\"date\":\"2026-03-0" + day + "\",\"unit\":\"bp\",\"yields\":{\"1M\":520,\"3M\":500,"
                            + "\"6M\":495,\"1Y\":490,\"2Y\":470,\"5Y\":465,\"10Y\":" + (480 - day) + ",\"30Y\":470}}")
                    .post("/api/quotes").then().statusCode(200);
        }
        List<String> metrics = metrics();
        assertThat(metrics).contains("slopewatch_spread_in_state{spread=\"GOVT-A:10Y-3M\",state=\"INVERTED\"} 1.0",
                "slopewatch_spread_in_state{spread=\"GOVT-A:10Y-3M\",state=\"NORMAL\"} 0.0",
                "slopewatch_spread_in_state{spread=\"GOVT-A:10Y-3M\",state=\"CONFIRMED\"} 0.0");
        assertThat(metrics).anyMatch(l -> l.startsWith("slopewatch_processing_seconds_bucket{"))
                .anyMatch(l -> l.startsWith("slopewatch_journal_write_seconds_bucket{"));
        assertThat(metrics).contains("slopewatch_info{policy=\"" + sha256(POLICY) + "\",version=\"" + pomVersion() + "\"} 1.0");
        assertThat(metrics).anyMatch(l -> l.startsWith("slopewatch_spread_value_bp{spread=\"GOVT-A:near-term-forward\"}"));

        // the same policy without the near-term forward spread
        String without = Files.readString(POLICY).replaceAll("(?s)  # The 3-month forward rate.*?rolling-average: \\{[^}]*\\}\\n", "");
        assertThat(without).doesNotContain("near-term-forward");
        Files.writeString(POLICY, without);
        given().post("/api/policy/reload").then().statusCode(200);

        List<String> after = metrics();
        assertThat(after).noneMatch(l -> l.contains("GOVT-A:near-term-forward") && !l.startsWith("#") && !l.startsWith("slopewatch_transitions"));
        assertThat(after).anyMatch(l -> l.startsWith("slopewatch_spread_value_bp{spread=\"GOVT-A:10Y-3M\"}"));
        assertThat(after).contains("slopewatch_info{policy=\"" + sha256(POLICY) + "\",version=\"" + pomVersion() + "\"} 1.0")
                .filteredOn(l -> l.startsWith("slopewatch_info{")).hasSize(1);
    }

    /** The age of each curve's latest quote, against the test's own clock readings around the post. */
    @Test
    void eachCurveSaysHowOldItsLatestQuoteIs() {
        // GOVT-B gets no quote in this test class: its age is not a number until one arrives
        assertThat(metrics()).contains("slopewatch_curve_last_quote_age_seconds{curve=\"GOVT-B\"} NaN");
        long before = System.nanoTime();
        given().contentType("application/json")
                .body("{\"curve\":\"GOVT-A\",\"date\":\"2026-03-09\",\"unit\":\"bp\",\"yields\":{\"3M\":500,\"10Y\":480}}")
                .post("/api/quotes").then().statusCode(200);
        String line = metrics().stream().filter(l -> l.startsWith("slopewatch_curve_last_quote_age_seconds{curve=\"GOVT-A\"}"))
                .findFirst().orElseThrow();
        double elapsed = (System.nanoTime() - before) / 1e9;
        double age = Double.parseDouble(line.substring(line.lastIndexOf(' ') + 1));
        assertThat(age).as(line).isBetween(0.0, elapsed + 0.001);
    }

    private static List<String> metrics() {
        return given().get("/q/metrics").then().statusCode(200).extract().asString().lines().toList();
    }

    private static String sha256(Path file) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
    }

    private static String pomVersion() throws Exception {
        return DocumentBuilderFactory.newInstance().newDocumentBuilder().parse(Path.of("pom.xml").toFile()).getDocumentElement()
                .getElementsByTagName("version").item(0).getTextContent().strip();
    }
}
