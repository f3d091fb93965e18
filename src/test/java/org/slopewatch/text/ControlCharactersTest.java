package org.slopewatch.text;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * Which characters are refused and how they are escaped. Source of the sets: the Unicode
 * Standard's general categories (UnicodeData.txt): Cc is U+0000..U+001F and U+007F..U+009F;
 * U+2028 is the only Zl character and U+2029 the only Zp (from memory); everything else, a
 * format character such as U+200B included, passes.
 */
class ControlCharactersTest {

    @Test
    void theControlCharactersAndTheLineAndParagraphSeparatorsAreRefused() {
        for (char c = 0; c < 0x20; c++) {
            assertThat(ControlCharacters.isRefused(c)).as("U+%04X", (int) c).isTrue();
        }
        for (char c = 0x7F; c <= 0x9F; c++) {
            assertThat(ControlCharacters.isRefused(c)).as("U+%04X", (int) c).isTrue();
        }
        assertThat(ControlCharacters.isRefused('\u2028')).isTrue();
        assertThat(ControlCharacters.isRefused('\u2029')).isTrue();
        for (char c : new char[] {' ', '~', '\u00A0', '\u00E9', '\u200B', '\u202E', '\uFEFF', '\uD83D'}) {
            assertThat(ControlCharacters.isRefused(c)).as("U+%04X", (int) c).isFalse();
        }
    }

    @Test
    void escapesAreReadableAndKeepEverythingElse() {
        assertThat(ControlCharacters.escape("a\nb\r\tc\u0000\u001b[2J\u0085\u2028 é 🚧"))
                .isEqualTo("a\\nb\\r\\tc\\u0000\\u001B[2J\\u0085\\u2028 é 🚧");
        String plain = "GOVT-A 10Y-3M";
        assertThat(ControlCharacters.escape(plain)).isSameAs(plain);
    }

    @Test
    void aMessageNamesTheCharacter() {
        assertThat(ControlCharacters.describe('\n')).isEqualTo("the control character U+000A");
        assertThat(ControlCharacters.describe('\u2028')).isEqualTo("the line separator U+2028");
        assertThat(ControlCharacters.describe('\u2029')).isEqualTo("the paragraph separator U+2029");
    }
}
