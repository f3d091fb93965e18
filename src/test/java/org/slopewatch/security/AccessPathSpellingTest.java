package org.slopewatch.security;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.common.http.TestHTTPResource;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.TestProfile;
import java.net.URI;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.security.ApiRoutes.Route;
import org.slopewatch.security.PathSpellings.Spelling;
import org.slopewatch.testsupport.RawHttp;

/**
 * Every route of the API ({@link ApiRoutes}, read from the resources' annotations, plus
 * {@code /q/openapi} and the metrics, closed in this profile) under every spelling of
 * {@link PathSpellings}, sent byte for byte on a plain socket ({@link RawHttp}) to the daemon with
 * access control on: without a token none may answer anything but 400, 401 or 404 (RFC 9110
 * sections 15.5.1, 15.5.2 and 15.5.5), and with a read token nothing that writes may succeed;
 * while a read token still reads every route by its canonical path, and a matrix parameter is
 * refused with 400 whatever the token.
 */
@QuarkusTest
@TestProfile(AccessControlTest.Locked.class)
class AccessPathSpellingTest {

    private static final Set<Integer> REFUSED_WITHOUT_TOKEN = Set.of(400, 401, 404);
    private static final Set<Integer> REFUSED_TO_A_READER = Set.of(400, 403, 404);
    private static final String QUOTE = "{\"curve\":\"GOVT-A\",\"date\":\"2026-03-02\",\"unit\":\"bp\",\"yields\":{\"3M\":500,\"10Y\":480}}";

    @TestHTTPResource("/")
    URI root;

    /** The API's routes and the Quarkus endpoints that carry data. */
    private static List<Route> targets() {
        List<Route> routes = new ArrayList<>(ApiRoutes.scan().routes());
        assertThat(routes).as("the scan of the resources found the API").contains(new Route("GET", "/api/spreads"), new Route("POST", "/api/quotes"));
        routes.add(new Route("GET", "/q/openapi"));
        routes.add(new Route("GET", "/q/metrics"));
        return routes;
    }

    @Test
    void withoutATokenNoSpellingOfAnyRouteIsAnswered() {
        RawHttp http = new RawHttp(root.getPort());
        List<String> leaks = new ArrayList<>();
        int sent = 0;
        for (Route route : targets()) {
            for (Spelling spelling : PathSpellings.all(root.getPort())) {
                RawHttp.Answer answer = http.send(route.method(), spelling.apply().apply(route.sample()) + route.query(), null, route.reads() ? null : "{}");
                sent++;
                if (!REFUSED_WITHOUT_TOKEN.contains(answer.status())) {
                    leaks.add(spelling.name() + ": " + answer.requestLine() + " -> " + answer.status() + " " + abbreviated(answer.body()));
                } else if (spelling.name().equals("canonical") && answer.status() != 401) {
                    // the route exists: its own spelling must be refused for want of a token, not missed
                    leaks.add("canonical: " + answer.requestLine() + " -> " + answer.status() + " instead of 401");
                }
            }
        }
        assertThat(sent).isGreaterThan(20 * 12);
        assertThat(leaks).as("answered without a token (of %d requests)", sent).isEmpty();
    }

    @Test
    void aReadTokenChangesNothingUnderAnySpelling() {
        RawHttp http = new RawHttp(root.getPort());
        List<String> leaks = new ArrayList<>();
        for (Route route : targets()) {
            if (route.reads()) {
                continue;
            }
            for (Spelling spelling : PathSpellings.all(root.getPort())) {
                RawHttp.Answer answer = http.send(route.method(), spelling.apply().apply(route.sample()) + route.query(), AccessControlTest.READ, "{}");
                if (!REFUSED_TO_A_READER.contains(answer.status())) {
                    leaks.add(spelling.name() + ": " + answer.requestLine() + " -> " + answer.status() + " " + abbreviated(answer.body()));
                }
            }
        }
        assertThat(leaks).as("a read token changed something").isEmpty();
    }

    @Test
    void aReadTokenReadsEveryRouteByItsCanonicalPathAndAMatrixParameterIsRefused() {
        given().header("Authorization", "Bearer " + AccessControlTest.WRITE).contentType("application/json").body(QUOTE)
                .post("/api/quotes").then().statusCode(200);
        RawHttp http = new RawHttp(root.getPort());
        List<String> wrong = new ArrayList<>();
        for (Route route : targets()) {
            if (!route.reads()) {
                continue;
            }
            RawHttp.Answer answer = http.send(route.method(), route.sample() + route.query(), AccessControlTest.READ, null);
            // a made-up id of a templated route may be unknown (404); every plain route answers
            boolean ok = answer.status() == 200 || (route.templated() && answer.status() == 404);
            if (!ok) {
                wrong.add(answer.requestLine() + " -> " + answer.status() + " " + abbreviated(answer.body()));
            }
            RawHttp.Answer matrix = http.send(route.method(), route.sample() + ";x" + route.query(), AccessControlTest.READ, null);
            if (matrix.status() != 400) {
                wrong.add(matrix.requestLine() + " -> " + matrix.status() + " (a matrix parameter should be 400)");
            }
        }
        assertThat(wrong).isEmpty();
    }

    private static String abbreviated(String body) {
        String flat = body.replaceAll("\\s+", " ");
        return flat.length() > 160 ? flat.substring(0, 160) + "…" : flat;
    }
}
