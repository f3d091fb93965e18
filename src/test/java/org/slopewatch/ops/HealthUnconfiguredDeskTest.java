package org.slopewatch.ops;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;

/**
 * Health on a daemon left as shipped: the policy {@code alert-rules/default.yaml}, whose critical
 * rule {@code inversion-confirmed} sends to {@code log}, {@code desk-chat} and {@code risk-email},
 * with neither of the last two configured, and the curves GOVT-A and GOVT-B of which only GOVT-A
 * is quoted. Readiness stays UP (quotes are taken and journalled); the wellness group, and with it
 * the overall {@code /q/health}, must not be UP. Answers are read as the MicroProfile Health
 * protocol lays them out ({@link HealthAnswer}: 200 UP, 503 DOWN).
 */
@QuarkusTest
@TestProfile(HealthUnconfiguredDeskTest.AsShipped.class)
class HealthUnconfiguredDeskTest {

    static final Path POLICY = Path.of("target", "test-data", "health-shipped-" + UUID.randomUUID(), "policy.yaml").toAbsolutePath();

    /** The shipped policy in a file of its own (the reload test edits it), no reload timer, the default channels. */
    public static final class AsShipped implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            try {
                Files.createDirectories(POLICY.getParent());
                Files.copy(Path.of("alert-rules/default.yaml"), POLICY, StandardCopyOption.REPLACE_EXISTING);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return Map.of("slopewatch.ingest.policy", POLICY.toString(),
                    "slopewatch.data-dir", POLICY.getParent().resolve("data").toString(),
                    "slopewatch.ingest.curves", "GOVT-A,GOVT-B",
                    "slopewatch.alerts.reload-check", "0s");
        }
    }

    @Test
    void theCriticalRuleWithItsChannelsUnconfiguredIsNotWellAndTheOverallHealthIsNotUp() {
        HealthAnswer well = HealthAnswer.of("/q/health/well");
        assertThat(well.checkStatus("alert channels")).as("the critical rule reaches only the log: %s", well).isEqualTo("DOWN");
        assertThat(well.data("alert channels", "inversion-confirmed")).as("named, with why")
                .startsWith("critical: cannot reach the desk").contains("desk-chat", "risk-email").contains("only log remains");
        assertThat(well.data("alert channels", "first-inversion")).as("an info rule with the log left still reaches someone")
                .startsWith("info: reaches the desk on log");
        assertThat(well.data("alert channels", "not configured")).contains("desk-chat (chat-webhook)", "risk-email (email)");
        assertThat(well.httpStatus()).isEqualTo(503);

        HealthAnswer overall = HealthAnswer.of("/q/health");
        assertThat(overall.status()).as("/q/health holds the wellness checks: %s", overall).isEqualTo("DOWN");
        assertThat(overall.httpStatus()).isEqualTo(503);
        assertThat(overall.checkStatus("alert channels")).isEqualTo("DOWN");

        HealthAnswer ready = HealthAnswer.of("/q/health/ready");
        assertThat(ready.httpStatus()).as("readiness is about taking quotes, which works: %s", ready).isEqualTo(200);
        assertThat(ready.checkStatus("alert channels")).as("not a readiness check").startsWith("(no check");
    }

    @Test
    void aCurveNeverQuotedIsNotFresh() {
        given().contentType("application/json")
                .body("{\"curve\":\"GOVT-A\",\"date\":\"2026-03-02\",\"unit\":\"bp\",\"yields\":{\"1M\":410,\"3M\":400,"
                        + "\"6M\":400,\"1Y\":405,\"2Y\":420,\"5Y\":435,\"10Y\":450,\"30Y\":460}}")
                .post("/api/quotes").then().statusCode(200);

        HealthAnswer well = HealthAnswer.of("/q/health/well");
        assertThat(well.checkStatus("feed freshness")).as("GOVT-B has no quote at all: %s", well).isEqualTo("DOWN");
        assertThat(well.data("feed freshness", "GOVT-B")).startsWith("never quoted");
        assertThat(well.data("feed freshness", "GOVT-A")).startsWith("fresh: last quote");
        assertThat(HealthAnswer.of("/q/health").checkStatus("feed freshness")).isEqualTo("DOWN");
    }

    @Test
    void aRejectedReloadShowsUntilTheFileIsBackToThePolicyInForce() throws IOException {
        String inForce = Files.readString(POLICY);
        assertThat(HealthAnswer.of("/q/health/well").checkStatus("policy reload")).isEqualTo("UP");
        try {
            // a rule naming a channel the policy does not declare: the parser refuses it with its position
            String broken = inForce.replace("channels: [log]", "channels: [log, night-pager]");
            assertThat(broken).as("the stale-feed rule's channel list is in the shipped policy").isNotEqualTo(inForce);
            Files.writeString(POLICY, broken);
            given().post("/api/policy/reload").then().statusCode(422);

            HealthAnswer well = HealthAnswer.of("/q/health/well");
            assertThat(well.checkStatus("policy reload")).as("%s", well).isEqualTo("DOWN");
            assertThat(well.data("policy reload", "rejected")).contains(POLICY.toString()).contains("the previous policy keeps running");
            assertThat(well.data("policy reload", "first problem")).contains(POLICY + ":").contains("night-pager");
            assertThat(HealthAnswer.of("/q/health").checkStatus("policy reload")).isEqualTo("DOWN");

            // then the file goes away: still rejected, now as unreadable, with no content to name
            Files.delete(POLICY);
            given().post("/api/policy/reload").then().statusCode(422);
            HealthAnswer gone = HealthAnswer.of("/q/health/well");
            assertThat(gone.checkStatus("policy reload")).as("%s", gone).isEqualTo("DOWN");
            assertThat(gone.data("policy reload", "rejected")).doesNotContain("sha256");
            assertThat(gone.data("policy reload", "first problem")).startsWith("cannot read " + POLICY);
        } finally {
            Files.writeString(POLICY, inForce);
        }
        given().post("/api/policy/reload").then().statusCode(200);
        assertThat(HealthAnswer.of("/q/health/well").checkStatus("policy reload")).as("the file is the policy in force again")
                .isEqualTo("UP");
    }
}
