package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * Policy texts that used to make the parser throw something other than a {@link PolicyException}
 * with a position, or accept what the journal cannot keep, each kept as the example that showed
 * it (docs/reliability.md, "what failed and was fixed"): the fuzzers ({@link PolicyParserFuzzTest})
 * or the bad-input corpus ({@code bench/faults/corpus}) found them.
 */
class PolicyParserHostileTest {

    private static final String DEFAULT = read("alert-rules/default.yaml");

    private static PolicyException problems(String text) {
        PolicyException e = catchThrowableOfType(PolicyException.class, () -> PolicyParser.parse("p.yaml", text));
        assertThat(e).as("a PolicyException").isNotNull();
        return e;
    }

    @Test
    void aRepeatIntervalTooLongForADurationIsAProblemAtItsPosition() {
        // found by the fuzzer: ArithmeticException (long overflow) and NumberFormatException escaped
        PolicyException e = problems(DEFAULT.replace("repeat-every: 1d", "repeat-every: 999999999999999d"));
        assertThat(e.getMessage()).isEqualTo("p.yaml:59:19: 'repeat-every' is too long to be a duration, got '999999999999999d'");
        assertThat(problems(DEFAULT.replace("repeat-every: 1d", "repeat-every: 99999999999999999999d")).getMessage())
                .startsWith("p.yaml:59:19: 'repeat-every' is too long");
    }

    @Test
    void deepNestingIsAProblemAtTheLevelTooDeepNotAStackOverflow() {
        // was: StackOverflowError from the YAML composer, which recurses once per level (10,000 flow levels did it)
        PolicyException flow = problems("watch: " + "[".repeat(100_000) + "]".repeat(100_000));
        assertThat(flow.getMessage()).isEqualTo("p.yaml:1:71: nested more than 64 levels deep");
        StringBuilder block = new StringBuilder("watch:\n");
        for (int i = 0; i < 1_000; i++) {
            block.append(" ".repeat(i + 1)).append("-\n");
        }
        assertThat(problems(block.toString()).getMessage()).endsWith(": nested more than 64 levels deep");
    }

    @Test
    void aSurrogatePairAtTheReadersBufferEdgeIsRead() throws PolicyException {
        // found by the fuzzer: snakeyaml-engine 2.10 threw IndexOutOfBoundsException when a surrogate pair (an emoji)
        // straddled the end of its 1,024-character buffer; the parser now gives it a buffer that holds the whole text
        for (int pad = 1_015; pad < 1_030; pad++) {
            String text = "# " + "x".repeat(pad) + "\uD83D\uDE00\n" + DEFAULT;
            assertThat(PolicyParser.parse("p.yaml", text).watches()).hasSize(3);
        }
        PolicyException lone = problems("# " + "x".repeat(1_022) + "\uD83D\nwatch: []\n");
        assertThat(lone.problems()).hasSize(1);
        assertThat(lone.getMessage()).startsWith("p.yaml:").contains("not valid YAML");
    }

    @Test
    void controlCharactersWrittenAsEscapesAreRefusedInTexts() {
        // was: accepted; a rule named or a message holding NUL then failed every journal write of its alerts on PostgreSQL
        PolicyException e = problems(DEFAULT.replace("\"{curve} {spread} is confirmed inverted", "\"{curve} {spread} is\\0 confirmed inverted"));
        assertThat(e.getMessage()).isEqualTo("p.yaml:61:14: 'message' contains the control character U+0000");
        assertThat(problems(DEFAULT.replace("name: first-inversion", "name: \"first\\x01inversion\"")).getMessage())
                .isEqualTo("p.yaml:63:11: 'name' contains the control character U+0001");
    }

    @Test
    void aRawControlCharacterIsPlacedAtItsLineAndColumn() {
        // was: reported at 1:1, the YAML reader's exception carrying only an offset
        assertThat(problems(DEFAULT.replace("watch:", "wa\u0000tch:")).getMessage())
                .isEqualTo("p.yaml:3:3: not valid YAML: special characters are not allowed (U+0000)");
    }

    @Test
    void anOversizedFileIsRefusedAtOnce() {
        // was: four million characters on one line took the YAML reader 2 to 10 seconds to refuse (measured);
        // the length is now checked before any YAML is read
        PolicyException e = problems("# " + "x".repeat(4_000_000) + "\n" + DEFAULT);
        assertThat(e.getMessage()).isEqualTo("p.yaml:1:1: the policy is " + (4_000_003 + DEFAULT.length())
                + " characters long; at most 1048576");
    }

    private static String read(String file) {
        try {
            return Files.readString(Path.of(file));
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }
}
