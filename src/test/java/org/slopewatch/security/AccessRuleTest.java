package org.slopewatch.security;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * The access rule as the operations issue states it: mutating endpoints need the write role,
 * reads the read role unless open, health always open, metrics as configured; and the token book
 * keeps hashes only (SHA-256 of the token's UTF-8 bytes; the test vector is the published
 * SHA-256 of "abc", FIPS 180-2 appendix B.1).
 */
class AccessRuleTest {

    @ParameterizedTest(name = "{0} {1} (open reads {2}, open metrics {3}) needs {4}")
    @CsvSource({
            "GET,    /api/spreads,                          false, true,  READ",
            "GET,    /api/spreads,                          true,  true,  NONE",
            "POST,   /api/quotes,                           true,  true,  WRITE",
            "POST,   /api/alerts/x~y~2026-01-01~1/ack,      true,  true,  WRITE",
            "DELETE, /api/mutes/3,                          true,  true,  WRITE",
            "POST,   /api/policy/reload,                    false, true,  WRITE",
            "POST,   /api/what-if,                          false, true,  WRITE",
            "GET,    /q/health/ready,                       false, false, NONE",
            "GET,    /q/health,                             false, false, NONE",
            "GET,    /q/metrics,                            false, true,  NONE",
            "GET,    /q/metrics,                            false, false, READ",
            "GET,    /q/openapi,                            false, true,  READ",
            "GET,    /,                                     false, true,  NONE",
            "GET,    /dashboard.js,                         false, true,  NONE",
            "POST,   /,                                     false, true,  WRITE"})
    void whichRoleARequestNeeds(String method, String path, boolean openReads, boolean openMetrics, String expected) {
        Optional<Role> needed = new AccessRule(openReads, openMetrics).needed(method, path);
        assertThat(needed.map(Role::name).orElse("NONE")).isEqualTo(expected);
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
