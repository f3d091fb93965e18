package org.slopewatch.security;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.TestProfile;
import io.restassured.response.Response;
import org.junit.jupiter.api.Test;

/**
 * Every kind of answer carries the hardening headers: the dashboard's files, an API answer, a
 * refusal of the access filter, a health answer and an unknown path. The header set follows the
 * usual recommendations for a service read by browsers (common practice: OWASP's secure-headers
 * guidance, from memory); Content-Security-Policy's directives are those of the W3C CSP Level 3
 * specification. Runs with access control on, under the same profile as {@link AccessControlTest}.
 */
@QuarkusTest
@TestProfile(AccessControlTest.Locked.class)
class ResponseHardeningTest {

    @Test
    void dashboardFilesAreHardened() {
        for (String path : new String[] {"/", "/index.html", "/dashboard.js", "/charts.js", "/dashboard.css"}) {
            Response answer = given().get(path);
            assertThat(answer.statusCode()).as(path).isEqualTo(200);
            assertHardened(path, answer);
        }
    }

    @Test
    void apiAnswersRefusalsAndUnknownPathsAreHardenedAndNotCached() {
        Response data = given().header("Authorization", "Bearer " + AccessControlTest.READ).get("/api/spreads");
        assertThat(data.statusCode()).isEqualTo(200);
        Response refused = given().get("/api/spreads");
        assertThat(refused.statusCode()).isEqualTo(401);
        Response unknown = given().header("Authorization", "Bearer " + AccessControlTest.READ).get("/api/no-such-route");
        assertThat(unknown.statusCode()).isEqualTo(404);
        Response health = given().get("/q/health/live");
        assertThat(health.statusCode()).isEqualTo(200);
        for (var entry : new Object[][] {{"/api/spreads", data}, {"refused /api/spreads", refused}, {"/api/no-such-route", unknown},
                {"/q/health/live", health}}) {
            String what = (String) entry[0];
            Response answer = (Response) entry[1];
            assertHardened(what, answer);
            assertThat(answer.header("Cache-Control")).as(what + ": desk data must not be cached").isEqualTo("no-store");
        }
    }

    private static void assertHardened(String what, Response answer) {
        assertThat(answer.header("X-Content-Type-Options")).as(what).isEqualTo("nosniff");
        assertThat(answer.header("X-Frame-Options")).as(what).isEqualTo("DENY");
        assertThat(answer.header("Referrer-Policy")).as(what).isEqualTo("no-referrer");
        String csp = answer.header("Content-Security-Policy");
        assertThat(csp).as(what).contains("default-src 'self'").contains("script-src 'self'").contains("frame-ancestors 'none'")
                .doesNotContain("unsafe-eval");
        assertThat(csp).as(what + ": scripts only from the daemon").doesNotContainPattern("script-src[^;]*unsafe-inline");
    }
}
