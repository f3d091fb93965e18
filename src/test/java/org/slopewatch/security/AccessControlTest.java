package org.slopewatch.security;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.anyOf;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.hamcrest.Matchers.is;
import static org.hamcrest.Matchers.not;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.specification.RequestSpecification;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.LogCapture;

/**
 * Every access rule on a running daemon with access control on: no token, a wrong one, the read
 * role and the write role, for reads, writes, health, metrics and the dashboard; every open path
 * answering without a token and its neighbours not; the 413 limits;
 * and no token in any answer or log line. The write token is configured as its SHA-256 only,
 * computed here with the JDK's MessageDigest, so the daemon never sees it in plain text.
 */
@QuarkusTest
@TestProfile(AccessControlTest.Locked.class)
public class AccessControlTest {

    public static final String READ = "read-" + UUID.randomUUID();
    public static final String WRITE = "write-" + UUID.randomUUID();
    static final String WRONG = "wrong-" + UUID.randomUUID();

    /**
     * Access control on, a read and a write token, metrics behind the read role, small limits,
     * and a copy of the shipped policy that a test may spoil and restore ({@link #policyFile()}).
     */
    public static final class Locked implements QuarkusTestProfile {

        private static Path policy;

        /** The policy file in force, a copy of {@code alert-rules/default.yaml} of this profile's own. */
        public static synchronized Path policyFile() {
            if (policy == null) {
                try {
                    Path dir = Files.createDirectories(Path.of("target", "test-data", "access-policy-" + UUID.randomUUID()));
                    policy = Files.copy(Path.of("alert-rules", "default.yaml"), dir.resolve("policy.yaml"));
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            }
            return policy;
        }

        @Override
        public Map<String, String> getConfigOverrides() {
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.ingest.policy", policyFile().toString());
            config.put("slopewatch.security.enabled", "true");
            config.put("slopewatch.security.read-tokens", READ);
            config.put("slopewatch.security.write-tokens", "sha256:" + HexFormat.of().formatHex(TokenBook.sha256(WRITE)));
            config.put("slopewatch.security.open-metrics", "false");
            config.put("slopewatch.ingest.max-batch", "50");
            config.put("quarkus.http.limits.max-body-size", "64K");
            config.put("slopewatch.data-dir", "./target/test-data/access-" + UUID.randomUUID());
            return config;
        }
    }

    private static RequestSpecification as(String token) {
        return token == null ? given() : given().header("Authorization", "Bearer " + token);
    }

    private static final String QUOTE = "{\"curve\":\"GOVT-A\",\"date\":\"2026-03-02\",\"unit\":\"bp\",\"yields\":{\"3M\":500,\"10Y\":480}}";

    @Test
    void readsNeedTheReadRole() {
        as(null).get("/api/spreads").then().statusCode(401)
                .header("WWW-Authenticate", containsString("Bearer"))
                .body("detail", containsString("needs a token with the read role"));
        as(WRONG).get("/api/spreads").then().statusCode(401).body("detail", equalTo("the bearer token is not valid"))
                .body(not(containsString(WRONG)));
        as(READ).get("/api/spreads").then().statusCode(200);
        as(WRITE).get("/api/spreads").then().statusCode(200); // a write token may read too
        as(null).get("/api/alerts").then().statusCode(401);
        as(READ).get("/api/alerts").then().statusCode(200);
        as(null).get("/api/policy/instances").then().statusCode(401);
        as(READ).get("/api/policy/instances").then().statusCode(200);
    }

    @Test
    void writesNeedTheWriteRole() {
        as(null).contentType("application/json").body(QUOTE).post("/api/quotes").then().statusCode(401);
        as(READ).contentType("application/json").body(QUOTE).post("/api/quotes").then().statusCode(403)
                .body("detail", containsString("may read but not change anything")).body(not(containsString(READ)));
        as(WRITE).contentType("application/json").body(QUOTE).post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));

        as(READ).contentType("application/json").body("{\"by\":\"x\"}").post("/api/alerts/any~id~2026-01-01~1/ack").then().statusCode(403);
        as(READ).contentType("application/json").body("{\"rule\":\"first-inversion\",\"lasts\":\"PT1H\",\"note\":\"r\",\"set_by\":\"x\"}")
                .post("/api/quiet-periods").then().statusCode(403);
        as(READ).post("/api/policy/reload").then().statusCode(403);
        as(WRITE).post("/api/policy/reload").then().statusCode(200).body("result", equalTo("unchanged"));
        as(WRITE).delete("/api/quiet-periods/999?lifted_by=ops").then().statusCode(404);
    }

    @Test
    void healthIsOpenMetricsFollowConfigurationAndThePageHoldsNoData() {
        as(null).get("/q/health/live").then().statusCode(200);
        as(null).get("/q/health/ready").then().statusCode(200);
        as(null).get("/q/metrics").then().statusCode(401);
        as(READ).get("/q/metrics").then().statusCode(200).body(containsString("slopewatch_alert_backlog"));
        as(null).get("/").then().statusCode(200).body(containsString("Caution"));
        as(null).get("/dashboard.js").then().statusCode(200);
    }

    @Test
    void everyOpenPathAnswersWithoutATokenAndNothingElseDoes() {
        // the open list names real endpoints: each answers with no token (so the list has no stale
        // entry); a health check may be DOWN, which SmallRye Health answers 503 (MicroProfile Health 4.0)
        for (String path : new AccessRule(false, false).openPaths()) {
            as(null).get(path).then().statusCode(AccessRule.HEALTH.contains(path) ? anyOf(is(200), is(503)) : is(200));
        }
        // and a path next to them that the list does not name is closed (deny by default)
        as(null).get("/q/health/group").then().statusCode(401).header("WWW-Authenticate", containsString("Bearer"));
        as(null).get("/favicon.ico").then().statusCode(401);
        as(null).get("/q/openapi").then().statusCode(401);
        as(READ).get("/q/openapi").then().statusCode(200);
        as(READ).get("/api;x/spreads").then().statusCode(400).body("detail", containsString("matrix parameters"));
    }

    @Test
    void tooLargeABodyOrBatchIs413AndNothingIsTaken() {
        String many = "[" + String.join(",", java.util.Collections.nCopies(51, QUOTE)) + "]";
        as(WRITE).contentType("application/json").body(many).post("/api/quotes").then().statusCode(413)
                .body("errors[0].detail", containsString("at most 50 per request"));
        String huge = "[" + QUOTE + "," + "\"" + "x".repeat(70 * 1024) + "\"]";
        as(WRITE).contentType("application/json").body(huge).post("/api/quotes").then().statusCode(413);
    }

    @Test
    void noTokenAppearsInAnyAnswerOrLogLine() {
        List<LogCapture.Line> lines;
        try (LogCapture logs = LogCapture.of("org.slopewatch", "io.quarkus", "io.vertx")) {
            for (String token : List.of(READ, WRITE, WRONG)) {
                for (String path : List.of("/api/spreads", "/q/metrics", "/api/transitions")) {
                    assertThat(as(token).get(path).asString()).doesNotContain(token);
                }
                assertThat(as(token).contentType("application/json").body(QUOTE).post("/api/quotes").asString()).doesNotContain(token);
            }
            lines = logs.lines();
        }
        for (LogCapture.Line line : lines) {
            assertThat(line.all()).doesNotContain(READ).doesNotContain(WRITE).doesNotContain(WRONG);
        }
    }
}
