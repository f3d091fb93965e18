package org.slopewatch.security;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.RestAssured;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.eclipse.microprofile.config.ConfigProvider;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.RawHttp;

/**
 * Requests that go nowhere must not fill the HTTP metrics. Quarkus's Micrometer binder labels
 * {@code http_server_requests} by {@code uri} and records at most
 * {@code quarkus.micrometer.binder.http-server.max-uri-tags} distinct values (100 by default,
 * Quarkus's Micrometer guide; the test reads the setting rather than assume it); past that, a new
 * {@code uri} is not recorded at all. So 150 junk paths without a token (refused, 401), 150
 * malformed ones (400, most of them from Vert.x before any filter) and 150 with a read token
 * (unmatched, 404) must leave the number of {@code uri} values small, none of them naming a junk
 * path, and an endpoint asked for the first time after all that must still be recorded. A profile
 * of its own, so that the daemon is fresh and the endpoint really is new.
 */
@QuarkusTest
@TestProfile(RefusedRequestMetricsTest.Fresh.class)
class RefusedRequestMetricsTest {

    private static final int JUNK = 150;
    /**
     * Request targets a server must refuse as malformed (RFC 3986 section 2: a backslash, braces,
     * angle brackets and a bar are not allowed in a URI, a percent sign starts an escape of two hex
     * digits), and a matrix parameter, which the access filter refuses; {@code %s} is a junk name.
     */
    private static final List<String> MALFORMED = List.of("/api/junk\\%s", "/api/junk%%zz%s", "/api/junk%s%%", "/junk<%s",
            "/junk{%s}", "/junk|%s", "/api;junk-%s");
    private static final Pattern SERIES = Pattern.compile("^http_server_requests_seconds_count\\{([^}]*)} ([0-9.E+]+)$", Pattern.MULTILINE);
    private static final Pattern URI = Pattern.compile("uri=\"([^\"]*)\"");

    /** The access-control profile on a daemon of its own. */
    public static final class Fresh implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            Map<String, String> config = new HashMap<>(new AccessControlTest.Locked().getConfigOverrides());
            config.put("slopewatch.data-dir", "./target/test-data/refused-metrics-" + UUID.randomUUID());
            return config;
        }
    }

    @Test
    void junkPathsShareABoundedSetOfLabelsAndARealEndpointIsStillRecordedAfterThem() {
        int cap = ConfigProvider.getConfig().getOptionalValue("quarkus.micrometer.binder.http-server.max-uri-tags", Integer.class).orElse(100);
        assertThat(JUNK).as("more junk of each kind than the binder keeps uri values").isGreaterThan(cap);
        String run = UUID.randomUUID().toString().substring(0, 8);
        RawHttp raw = new RawHttp(RestAssured.port);
        for (int i = 0; i < JUNK; i++) {
            // refused by the access filter for want of a token
            given().get("/api/junk-" + run + "-" + i).then().statusCode(401);
        }
        for (int i = 0; i < JUNK; i++) {
            // refused before any filter: Vert.x does not take these paths (a matrix parameter is the filter's 400)
            String target = MALFORMED.get(i % MALFORMED.size()).formatted(run + "-" + i);
            assertThat(raw.send("GET", target, null, null).status()).as(target).isBetween(400, 499);
        }
        for (int i = 0; i < JUNK; i++) {
            // let through with a token, matched by no route
            given().header("Authorization", "Bearer " + AccessControlTest.READ).get("/api/junk-" + run + "-read-" + i).then().statusCode(404);
        }
        // asked for the first time only now, after the junk
        given().header("Authorization", "Bearer " + AccessControlTest.READ).get("/api/rejects").then().statusCode(200);

        Map<String, Double> byUri = requestsByUri();
        assertThat(byUri).as("the endpoint asked for after the junk is recorded (%d uri labels)", byUri.size()).containsKey("/api/rejects");
        assertThat(byUri.get("/api/rejects")).isEqualTo(1.0);
        assertThat(byUri.keySet()).as("uri labels").noneMatch(uri -> uri.contains("junk"));
        assertThat(byUri.size()).as("distinct uri labels: %s", byUri.keySet()).isLessThanOrEqualTo(10);
        assertThat(byUri.get("/refused")).as("the refused requests, under one label").isGreaterThanOrEqualTo(JUNK);
        assertThat(byUri.get("NOT_FOUND")).as("the unmatched ones, under Micrometer's own label").isGreaterThanOrEqualTo(JUNK);
    }

    /** The request counts of {@code http_server_requests} summed by {@code uri}, from the Prometheus text. */
    private static Map<String, Double> requestsByUri() {
        String text = given().header("Authorization", "Bearer " + AccessControlTest.READ).get("/q/metrics").then().statusCode(200).extract().asString();
        Map<String, Double> byUri = new TreeMap<>();
        Matcher series = SERIES.matcher(text);
        while (series.find()) {
            Matcher uri = URI.matcher(series.group(1));
            assertThat(uri.find()).as("a uri label in %s", series.group()).isTrue();
            byUri.merge(uri.group(1), Double.parseDouble(series.group(2)), Double::sum);
        }
        assertThat(byUri).as("http_server_requests in the metrics").isNotEmpty();
        return byUri;
    }
}
