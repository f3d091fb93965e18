package org.slopewatch.text;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** An excerpt is the input up to 200 characters, control characters escaped, and beyond that cut with its length. */
class ExcerptTest {

    @Test
    void shortTextIsQuotedAsItIs() {
        assertThat(Excerpt.quoted("GOVT-A")).isEqualTo("'GOVT-A'");
        assertThat(Excerpt.of("GOVT-A")).isEqualTo("GOVT-A");
        assertThat(Excerpt.quoted("x".repeat(200))).isEqualTo("'" + "x".repeat(200) + "'");
    }

    @Test
    void longTextIsCutWithItsLength() {
        assertThat(Excerpt.quoted("C".repeat(20_000))).isEqualTo("'" + "C".repeat(200) + "…' (20000 characters)");
        assertThat(Excerpt.of("C".repeat(201))).isEqualTo("C".repeat(200) + "… (201 characters)");
        assertThat(Excerpt.cut("m".repeat(1_500), 1_000)).isEqualTo("m".repeat(1_000) + "… (1500 characters)");
    }

    @Test
    void aLineBreakNeverReachesTheMessage() {
        assertThat(Excerpt.quoted("10Y\n2026-05-07 INFO forged")).isEqualTo("'10Y\\n2026-05-07 INFO forged'");
        assertThat(Excerpt.of("\r\n".repeat(500))).doesNotContain("\n").doesNotContain("\r").endsWith("… (1000 characters)");
    }

    @Test
    void aCutNeverSplitsASurrogatePair() {
        // U+1F6A7 is two UTF-16 units; with 199 letters before it, unit 200 is its high half
        String text = "a".repeat(199) + "🚧" + "b".repeat(50);
        assertThat(Excerpt.of(text)).isEqualTo("a".repeat(199) + "… (251 characters)");
    }
}
