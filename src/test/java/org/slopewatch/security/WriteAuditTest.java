package org.slopewatch.security;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.awaitility.Awaitility.await;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.TestProfile;
import java.time.Duration;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.LogCapture;

/**
 * A change made through the API leaves one log line naming the token by the start of its SHA-256
 * (computed here with the JDK's MessageDigest, as an operator would with {@code sha256sum}),
 * where it came from and what was answered; reads and quote submissions leave none, and the token
 * itself never appears.
 */
@QuarkusTest
@TestProfile(AccessControlTest.Locked.class)
class WriteAuditTest {

    @Test
    void changesAreLoggedWithTheTokenFingerprintOnly() throws Exception {
        String fingerprint = HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
                .digest(AccessControlTest.WRITE.getBytes(java.nio.charset.StandardCharsets.UTF_8))).substring(0, 12);
        try (LogCapture logs = LogCapture.of("org.slopewatch.security")) {
            given().header("Authorization", "Bearer " + AccessControlTest.WRITE).post("/api/policy/reload").then().statusCode(200);
            given().header("Authorization", "Bearer " + AccessControlTest.WRITE).get("/api/spreads").then().statusCode(200);
            given().header("Authorization", "Bearer " + AccessControlTest.WRITE).contentType("application/json")
                    .body("{\"curve\":\"GOVT-A\",\"date\":\"2026-03-03\",\"unit\":\"bp\",\"yields\":{\"3M\":500,\"10Y\":480}}")
                    .post("/api/quotes").then().statusCode(200);
            await().atMost(Duration.ofSeconds(10)).until(() -> logs.lines().stream().anyMatch(l -> l.message().contains("api change")));
            List<String> audit = logs.lines().stream().map(LogCapture.Line::message).filter(m -> m.contains("api change")).toList();
            assertThat(audit).singleElement().satisfies(line -> assertThat(line)
                    .contains("POST /api/policy/reload")
                    .contains("by token sha256:" + fingerprint)
                    .contains("from 127.0.0.1")
                    .contains("answered 200")
                    .doesNotContain(AccessControlTest.WRITE));
        }
    }
}
