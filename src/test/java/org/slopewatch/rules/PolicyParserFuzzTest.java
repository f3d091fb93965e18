package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.testsupport.Gen;
import org.slopewatch.testsupport.PropertyCheck;

/**
 * The policy parser answers any text with a policy or a {@link PolicyException} whose every
 * problem has a position in the file ({@code file:line:column}) and a message: arbitrary text,
 * and the shipped policy ({@code alert-rules/default.yaml}) mutated line by line and value by
 * value (lines deleted, duplicated, swapped, re-indented; values replaced by wrong types,
 * extremes, aliases, tags, templates, deep nesting and alias bombs; text cut or spliced).
 * No other exception escapes, and a policy that is accepted can run: its monitors take
 * snapshots and its alert rules build an engine without an exception.
 *
 * <p>Each property runs 10,000 tries in the suite; {@code -Dfuzz.tries=N} runs more (see
 * docs/reliability.md). A failure prints the seed that makes its sample again ({@link PropertyCheck}).
 */
class PolicyParserFuzzTest {

    private static final String FILE = "fuzz.yaml";
    private static final List<String> DEFAULT_LINES = defaultPolicy().lines().toList();

    private static final int TRIES = PropertyCheck.fuzzTries(10_000);

    @Test
    void arbitraryTextIsAPolicyOrProblemsWithPositions() {
        PropertyCheck.forAll(TRIES, texts(), PolicyParserFuzzTest::check);
    }

    @Test
    void mutatedDefaultPolicyIsAPolicyOrProblemsWithPositions() {
        PropertyCheck.forAll(TRIES, mutations(), PolicyParserFuzzTest::checkMutated);
    }

    private static void checkMutated(List<Mutation> mutations) {
        List<String> lines = new ArrayList<>(DEFAULT_LINES);
        String text = null;
        for (Mutation m : mutations) {
            if (text == null && m.kind().lineWise) {
                m.applyTo(lines);
            } else {
                text = m.applyTo(text == null ? String.join("\n", lines) + "\n" : text);
            }
        }
        check(text == null ? String.join("\n", lines) + "\n" : text);
    }

    /** The invariants, for any text. */
    private static void check(String text) {
        Policy policy;
        try {
            policy = PolicyParser.parse(FILE, text);
        } catch (PolicyException e) {
            long lines = text.chars().filter(c -> c == '\n' || c == '\r' || c == '\u0085' || c == '\u2028' || c == '\u2029').count() + 1;
            assertThat(e.problems()).as("a rejected policy names at least one problem").isNotEmpty();
            for (PolicyProblem p : e.problems()) {
                assertThat(p.file()).isEqualTo(FILE);
                assertThat(p.line()).as("line of " + p).isBetween(1, (int) lines + 1);
                assertThat(p.column()).as("column of " + p).isPositive();
                assertThat(p.message()).as("message of " + p).isNotBlank();
            }
            return;
        }
        SignalEngine engine = new SignalEngine(policy.watches());
        LocalDate date = LocalDate.of(2026, 3, 31);
        for (int day = 0; day < 3; day++) {
            engine.onSnapshot(CurveSnapshot.of("GOVT-A", date.plusDays(day), Map.of(Tenor.months(3), 500.0 + day, Tenor.years(2), 480.0,
                    Tenor.years(5), 470.0, Tenor.years(10), 460.0 - 30 * day, Tenor.years(30), 470.0)), day + 1);
        }
        new AlertEngine(policy.alerts()).decide(List.of(), Instant.parse("2026-04-02T12:00:00Z"));
    }

    // --- arbitrary text ---

    private static Gen<String> texts() {
        return Gen.oneOf(Gen.strings(300), Gen.strings("-:[]{},&*!|>'\"#%@`?\\ \t\n.0123456789abwtchspredY~", 300));
    }

    // --- mutations of the shipped policy ---

    /** What a mutation does; line-wise ones work on the lines (before any text mutation), the others on the text. */
    enum Kind {
        DELETE_LINE(true), DUPLICATE_LINE(true), SWAP_LINES(true), INDENT(true), DEDENT(true), REPLACE_VALUE(true), INSERT_LINE(true),
        TRUNCATE(false), INSERT_TEXT(false), DELETE_CHAR(false), APPEND(false);

        final boolean lineWise;

        Kind(boolean lineWise) {
            this.lineWise = lineWise;
        }
    }

    /** One mutation: {@code where} picks the line or position (modulo what there is), {@code hostile} what is put in. */
    record Mutation(Kind kind, int where, String hostile) {

        void applyTo(List<String> lines) {
            if (lines.isEmpty()) {
                return;
            }
            int i = Math.floorMod(where, lines.size());
            String line = lines.get(i);
            switch (kind) {
                case DELETE_LINE -> lines.remove(i);
                case DUPLICATE_LINE -> lines.add(i, line);
                case SWAP_LINES -> {
                    int j = Math.floorMod(i + 1, lines.size());
                    lines.set(i, lines.get(j));
                    lines.set(j, line);
                }
                case INDENT -> lines.set(i, "  " + line);
                case DEDENT -> lines.set(i, line.startsWith("  ") ? line.substring(2) : line.stripLeading());
                case REPLACE_VALUE -> {
                    // the value after the first "key: " on the line, or the whole item after "- "
                    int colon = line.indexOf(": ");
                    int dash = line.indexOf("- ");
                    int cut = colon >= 0 ? colon + 2 : dash >= 0 ? dash + 2 : line.length();
                    lines.set(i, line.substring(0, cut) + hostile);
                }
                default -> lines.add(i, line.substring(0, line.length() - line.stripLeading().length()) + hostile);
            }
        }

        String applyTo(String text) {
            int at = text.isEmpty() ? 0 : Math.floorMod(where, text.length());
            return switch (kind) {
                case TRUNCATE -> text.substring(0, at);
                case INSERT_TEXT -> text.substring(0, at) + hostile + text.substring(at);
                case DELETE_CHAR -> text.isEmpty() ? text : text.substring(0, at) + text.substring(at + 1);
                default -> text + "\n" + hostile + "\n";
            };
        }
    }

    /** Values and lines a hostile or careless author might write. */
    private static final List<String> HOSTILE = List.of(".nan", ".inf", "-.inf", "1e400", "-1", "0", "2147483647", "2147483648",
            "99999999999999999999", "''", "~", "null", "[]", "{}", "[a, [b, [c]]]", "*nope", "&a x", "!!binary AAAA",
            "!!java.lang.Runtime {}", "!include /etc/passwd", "${env:HOME}", "\"{{7*7}}\"", "\"#{1+1}\"", "\"file:/etc/passwd\"",
            "\"${jndi:ldap://example.invalid/a}\"", "\"a\\0b\"", "\"\\x01\"", "yes", "on", "0x1F", "0o17", "1_000", ".5", "+1",
            "10Y-10Y", "3M-10Y", "99Y-3M", "near-term-forward", "999999999999999d", "99999999999999999999d", "30s", "CONFIRMED",
            "<<: *a", "\"" + "x".repeat(300) + "\"", "[".repeat(5_000) + "]".repeat(5_000), "{a: ".repeat(150) + "1" + "}".repeat(150),
            "|\n  block", ">-", "? complex", "- item", "&x [*x]", "spread: 10Y-3M", "enters-state: RESTEEPENING",
            "inverted-for-days: 0", "probability-above: 1", "spread-below-bp: -1e308", "feed-stale: false",
            "message: \"{curve} {nope}\"", "message: \"{{curve}}\"", "channels: [nowhere]", "type: carrier-pigeon",
            "average: weekly", "covariance: {var-alpha: 1, cov-alpha-beta: 5, var-beta: 1}", "horizon-months: -1",
            "share-inverted: {days: 10, share: 1.5}", "rolling-average: {days: 0}", "days-inverted: {}", "quarter-average",
            "l0: &l0 [x, x]\nl1: &l1 [*l0, *l0]\nl2: &l2 [*l1, *l1]\nl3: &l3 [*l2, *l2]",
            "a: &a [x,x,x,x,x,x,x,x,x]\nb: &b [*a,*a,*a,*a,*a,*a,*a,*a,*a]\nc: &c [*b,*b,*b,*b,*b,*b,*b,*b,*b]\nd: &d [*c,*c,*c,*c,*c,*c,*c,*c,*c]\n"
                    + "e: &e [*d,*d,*d,*d,*d,*d,*d,*d,*d]\nf: &f [*e,*e,*e,*e,*e,*e,*e,*e,*e]",
            "---\nwatch: []", "%YAML 1.1\n---", "\t- tab", "\uFEFF", "\u0085", "\u2028");

    private static Gen<List<Mutation>> mutations() {
        Gen<Kind> kinds = Gen.of(Kind.class);
        Gen<Integer> places = Gen.ints(0, 1 << 20);
        Gen<String> hostile = Gen.oneOf(Gen.of(HOSTILE), Gen.strings(6));
        Gen<Mutation> one = r -> new Mutation(kinds.next(r), places.next(r), hostile.next(r));
        return one.list(1, 4);
    }

    private static String defaultPolicy() {
        try {
            return Files.readString(Path.of("alert-rules/default.yaml"));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
