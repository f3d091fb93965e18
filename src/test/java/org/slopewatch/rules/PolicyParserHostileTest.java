package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Collections;
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
        PolicyException e = problems(DEFAULT.replace("standing-every: 1d", "standing-every: 999999999999999d"));
        assertThat(e.getMessage()).isEqualTo("p.yaml:59:21: 'standing-every' is too long to be a duration, got '999999999999999d'");
        assertThat(problems(DEFAULT.replace("standing-every: 1d", "standing-every: 99999999999999999999d")).getMessage())
                .startsWith("p.yaml:59:21: 'standing-every' is too long");
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

    @Test
    void aliasesOfALongTextAreRefusedByWhatTheyExpandTo() {
        // was: the YAML reader limits only aliases of lists and mappings (50), so 7,000 aliases of one 5,000-character
        // text passed, and each became a problem quoting the whole text: 35 MB of message from a 33 kB file
        String text = "x: &x \"" + "y".repeat(5_000) + "\"\nwatch:\n  - spread: 10Y-3M\n    confirm: ["
                + String.join(", ", Collections.nCopies(7_000, "*x")) + "]\n";
        PolicyException e = assertTimeoutPreemptively(Duration.ofSeconds(10), () -> problems(text));
        // Counted by hand, one per node plus the characters of each text: the top mapping 1, 'x' 2, the text 5,001,
        // 'watch' 6, its list 1, the entry 1, 'spread' 7, '10Y-3M' 7, 'confirm' 8, its list 1: 5,035; each alias
        // adds 5,001, so the 209th passes 1,048,576 (5,035 + 209 x 5,001 = 1,050,244). "    confirm: [" is 14
        // characters and the aliases 4 apart: the 209th is at column 15 + 208 x 4 = 847.
        assertThat(e.getMessage()).isEqualTo("p.yaml:4:847: with its aliases expanded the policy is larger than the limit of 1048576 "
                + "characters and nodes");
    }

    @Test
    void aLongValueIsQuotedAsAnExcerptWithItsLength() {
        // was: the whole value quoted, here 300,000 characters of message for one problem
        PolicyException e = problems("watch:\n  - spread: 10Y-3M\n    confirm: [" + "q".repeat(300_000) + "]\n");
        assertThat(e.getMessage()).isEqualTo("p.yaml:3:15: unknown persistence test '" + "q".repeat(200) + "…' (300000 characters) "
                + "(expected quarter-average, days-inverted:DAYS, rolling-average:DAYS or share-inverted:DAYS:SHARE)");
    }

    @Test
    void aHundredProblemsAreListedAndTheRestCounted() {
        // was: every problem listed, so a list of 5,000 unknown names answered with 5,000 lines (and a megabyte-long
        // list of them with hundreds of thousands)
        PolicyException e = problems("watch:\n  - spread: 10Y-3M\n    confirm: [" + String.join(", ", Collections.nCopies(5_000, "weekly"))
                + "]\n");
        assertThat(e.problems()).hasSize(100);
        assertThat(e.getMessage().split(System.lineSeparator())).hasSize(101);
        assertThat(e.getMessage()).startsWith("p.yaml:3:15: unknown persistence test 'weekly'").endsWith("p.yaml: 4900 more problems not listed");
    }

    @Test
    void aLineBreakInAQuotedValueIsEscapedSoEachProblemIsOneLine() {
        // was: a value holding a line break was quoted as it is, and its problem spread over two lines of the message
        PolicyException e = problems("watch:\n  - spread: 10Y-3M\n    confirm: [\"weekly\\nstate: CONFIRMED\"]\n");
        assertThat(e.getMessage()).isEqualTo("p.yaml:3:15: unknown persistence test 'weekly\\nstate: CONFIRMED' (expected quarter-average, "
                + "days-inverted:DAYS, rolling-average:DAYS or share-inverted:DAYS:SHARE)");
    }

    @Test
    void aRuleOrChannelNameLongerThanTheJournalHoldsIsAProblem() {
        // was: accepted; alert.rule and delivery.channel hold 100 characters, so every notice of the rule failed its write
        String longName = "n".repeat(101);
        assertThat(problems(DEFAULT.replace("name: first-inversion", "name: " + longName)).getMessage())
                .isEqualTo("p.yaml:63:11: 'name' is 101 characters long; at most 100");
    }

    private static String read(String file) {
        try {
            return Files.readString(Path.of(file));
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }
}
