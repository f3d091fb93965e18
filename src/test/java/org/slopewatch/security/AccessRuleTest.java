package org.slopewatch.security;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HexFormat;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * The access rule: denied by default, so a request needs the read role (GET, HEAD, OPTIONS) or
 * the write role (any other method) unless its raw path is exactly an open one (health, the
 * dashboard's files, metrics as configured) or reads are open and the path is the API's in normal
 * form (RFC 3986 section 6.2.2); a matrix parameter (RFC 3986 section 3.3) is malformed. The token book
 * keeps hashes only (SHA-256 of the token's UTF-8 bytes; the test vector is the published
 * SHA-256 of "abc", FIPS 180-2 appendix B.1).
 */
class AccessRuleTest {

    @ParameterizedTest(name = "{0} {1} (open reads {2}, open metrics {3}) needs {4}")
    @CsvSource({
            "GET,     /api/spreads,                          false, true,  READ",
            "GET,     /api/spreads,                          true,  true,  NONE",
            "HEAD,    /api/spreads,                          false, true,  READ",
            "GET,     /api/spreads/GOVT-A%3A10Y-3M/history,  true,  true,  NONE",
            "GET,     /api/spreads/GOVT-A:10Y-3M/history,    true,  true,  NONE",
            "GET,     /api/alerts/first-inversion~GOVT-A:10Y-3M~2026-03-02~1, true, true, NONE",
            "POST,    /api/quotes,                           true,  true,  WRITE",
            "POST,    /api/alerts/x~y~2026-01-01~1/ack,      true,  true,  WRITE",
            "DELETE,  /api/quiet-periods/3,                  true,  true,  WRITE",
            "POST,    /api/policy/reload,                    false, true,  WRITE",
            "POST,    /api/what-if,                          false, true,  WRITE",
            "GET,     /q/health/ready,                       false, false, NONE",
            "GET,     /q/health,                             false, false, NONE",
            "GET,     /q/health/well,                        false, false, NONE",
            "POST,    /q/health,                             false, false, WRITE",
            "GET,     /q/metrics,                            false, true,  NONE",
            "GET,     /q/metrics,                            false, false, READ",
            "GET,     /q/metrics,                            true,  false, READ",
            "GET,     /q/metrics/,                           false, true,  READ",
            "GET,     /q/openapi,                            false, true,  READ",
            "GET,     /q/openapi,                            true,  true,  NONE",
            "GET,     /q/swagger-ui,                         true,  true,  READ",
            "GET,     /,                                     false, true,  NONE",
            "GET,     /dashboard.js,                         false, true,  NONE",
            "OPTIONS, /index.html,                           false, true,  NONE",
            "POST,    /,                                     false, true,  WRITE",
            // deny by default: anything not spelled exactly as an open path needs a token
            "GET,     /favicon.ico,                          false, true,  READ",
            "GET,     /q/health/group,                       false, true,  READ",
            "GET,     /q/health/,                            false, true,  READ",
            "GET,     /Q/health,                             false, true,  READ",
            "GET,     //q/health,                            false, true,  READ",
            "GET,     /q/%68ealth,                           false, true,  READ",
            "GET,     /index.html/../api/spreads,            false, true,  READ",
            "GET,     /q/health/../../api/spreads,           false, true,  READ",
            "GET,     /dashboard.js%2F..%2Fapi%2Fspreads,    false, true,  READ",
            "GET,     /api,                                  true,  true,  READ",
            "GET,     /API/spreads,                          true,  true,  READ",
            // open reads: only a path in normal form (RFC 3986 section 6.2.2) counts as the API
            "GET,     //api/spreads,                         true,  false, READ",
            "GET,     /api/../q/metrics,                     true,  false, READ",
            "GET,     /api/%2e%2e/q/metrics,                 true,  false, READ",
            "GET,     /api/./spreads,                        true,  false, READ",
            "GET,     /%61pi/spreads,                        true,  false, READ",
            "GET,     /api/spreads\\x,                     true,  false, READ",
            "GET,     /api/spreads/,                         true,  false, READ",
            "GET,     /api/spreads%,                         true,  false, READ",
            "GET,     /api/spreads%4,                        true,  false, READ",
            "GET,     http://h/api/spreads,                  true,  false, READ",
            // a matrix parameter, raw or escaped, is malformed whatever the method and token
            "GET,     /api;x/spreads,                        false, true,  MALFORMED",
            "GET,     /api/spreads;x,                        true,  true,  MALFORMED",
            "GET,     /q/health/..;/..;/api/spreads,         false, true,  MALFORMED",
            "GET,     /dashboard.js;/../api/spreads,         false, true,  MALFORMED",
            "GET,     /api%3bx/spreads,                      false, true,  MALFORMED",
            "POST,    /api;/quotes,                          false, true,  MALFORMED",
            "GET,     /index.html;x,                         false, true,  MALFORMED"})
    void whichRoleARequestNeeds(String method, String path, boolean openReads, boolean openMetrics, String expected) {
        Access needed = new AccessRule(openReads, openMetrics).needed(method, path);
        String got = needed instanceof Access.Token token ? token.role().name() : needed instanceof Access.Open ? "NONE" : "MALFORMED";
        assertThat(got).isEqualTo(expected);
    }

    @Test
    void theDashboardsOpenFilesAreExactlyTheFilesItShips() throws IOException {
        Path resources = Path.of("src", "main", "resources", "META-INF", "resources");
        Set<String> shipped = new TreeSet<>();
        shipped.add("/");
        try (Stream<Path> files = Files.walk(resources)) {
            files.filter(Files::isRegularFile).forEach(f -> shipped.add("/" + resources.relativize(f).toString().replace('\\', '/')));
        }
        assertThat(new TreeSet<>(AccessRule.DASHBOARD)).isEqualTo(shipped);
    }

    @Test
    void theOpenPathsAreTheHealthEndpointsTheDashboardAndTheMetricsWhenOpen() {
        assertThat(new AccessRule(false, false).openPaths()).containsExactlyInAnyOrderElementsOf(
                Stream.concat(AccessRule.HEALTH.stream(), AccessRule.DASHBOARD.stream()).toList());
        assertThat(new AccessRule(true, true).openPaths()).contains(AccessRule.METRICS).hasSize(AccessRule.HEALTH.size() + AccessRule.DASHBOARD.size() + 1);
    }

    @Test
    void tokensAreKeptAsHashesAndAWriteTokenMayRead() {
        String abcHash = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"; // SHA-256("abc"), FIPS 180-2
        assertThat(HexFormat.of().formatHex(TokenBook.sha256("abc"))).isEqualTo(abcHash);
        TokenBook book = TokenBook.of(List.of("a-read-token-of-sixteen"), List.of("sha256:" + abcHash.toUpperCase()));
        assertThat(book.roleOf("a-read-token-of-sixteen")).contains(Role.READ);
        assertThat(book.roleOf("abc")).contains(Role.WRITE);
        assertThat(book.roleOf("abd")).isEmpty();
        assertThat(Role.WRITE.covers(Role.READ)).isTrue();
        assertThat(Role.READ.covers(Role.WRITE)).isFalse();
    }

    @Test
    void weakOrMalformedTokensAreRefusedWithoutShowingThem() {
        assertThatThrownBy(() -> TokenBook.of(List.of(), List.of("short-secret")))
                .hasMessage("a write token must be at least 16 characters long").hasMessageNotContaining("short-secret");
        assertThatThrownBy(() -> TokenBook.of(List.of("sha256:12ab"), List.of()))
                .hasMessage("a hashed read token must be sha256: followed by 64 hex digits");
    }
}
