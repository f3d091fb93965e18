package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.rules.Severity;

/**
 * {@code slopewatch replay --rules} on real history: two policies that differ only in how they
 * confirm an inversion of 10Y−1Y, on a history file and on a journal.
 *
 * <p>Data: monthly U.S. Treasury constant-maturity yields 1953-04 to 1999-09, Federal Reserve
 * H.15 via R package tseries data set {@code tcm} (src/test/resources/reference/README.md).
 * Rules: {@code alert-rules/README.md}. {@code quarter-average}: a complete calendar quarter
 * averaging below 0 bp confirms on the first observation after it, if the spell is still open;
 * {@code days-inverted: 90}: confirms on the first observation 90 or more calendar days after
 * the spell's first; a spell ends on the first observation at or above 0 bp. The rule
 * {@code enters-state: CONFIRMED} fires when the spread is CONFIRMED after a month's step and
 * resolves when it no longer is. The expected notices are computed below from the file's rows
 * by these definitions ({@link #confirmations}), not by the engine.
 */
class WhatIfCommandTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final String SUBJECT = "US:10Y-1Y";
    private static Path history;
    private static Path quarterPolicy;
    private static Path daysPolicy;
    /** Month, 10Y − 1Y in basis points, in file order. */
    private static TreeMap<LocalDate, Double> spread;

    @TempDir
    Path dir;

    /** One confirmed spell: its notice under a policy, and the month it resolved (null while open at the end of the data). */
    record Confirmation(LocalDate spellStart, LocalDate confirmed, LocalDate resolved) {
    }

    @BeforeAll
    static void readTheFile() throws Exception {
        history = resource("reference/us-cmt-monthly-1953-1999.csv");
        quarterPolicy = resource("policies/whatif-quarter-average.yaml");
        daysPolicy = resource("policies/whatif-days-inverted-90.yaml");
        spread = new TreeMap<>();
        List<String> lines = Files.readAllLines(history);
        assertThat(lines.get(0)).isEqualTo("date,1Y,3Y,5Y,10Y");
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",");
            spread.put(LocalDate.parse(f[0]), Double.parseDouble(f[4]) * 100 - Double.parseDouble(f[1]) * 100);
        }
    }

    @Test
    void onTheFileTheTriedPolicysNoticesAreThoseItsRuleGives() throws IOException {
        CliRun run = CliRun.of("replay", history.toString(), "--curve", "US", "--rules", daysPolicy.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode report = JSON.readTree(run.out());
        List<String> expected = new ArrayList<>();
        for (Confirmation c : confirmations(false)) {
            expected.add("FIRING " + c.confirmed() + " since " + c.confirmed());
            if (c.resolved() != null) {
                expected.add("RESOLVED " + c.resolved() + " since " + c.confirmed());
            }
        }
        List<String> actual = new ArrayList<>();
        report.get("would_fire").forEach(n -> actual.add(n.get("kind").asText() + " " + n.get("market_date").asText() + " since "
                + n.get("episode_since").asText()));
        assertThat(actual).isEqualTo(expected).isNotEmpty();
        assertThat(report.get("compared").asBoolean()).isFalse();
        assertThat(report.get("quotes").asLong()).isEqualTo(558);
        assertThat(report.get("policy_sha256").asText()).hasSize(64);
    }

    @Test
    void theTwoRulesConfirmTheSameSpellsOnDatesTheirDefinitionsGive() {
        List<Confirmation> quarter = confirmations(true);
        List<Confirmation> days = confirmations(false);
        // the first run of negative quarters in the data's notes is 1957Q3 (reference/README.md): its close confirms
        assertThat(quarter.get(0).confirmed()).isEqualTo(LocalDate.of(1957, 10, 1));
        assertThat(quarter).as("confirmations by quarter average").hasSizeGreaterThan(5);
        assertThat(days).as("confirmations by 90 days").hasSizeGreaterThan(5);
        assertThat(quarter.stream().map(Confirmation::spellStart)).as("some spells are confirmed by one rule only")
                .isNotEqualTo(days.stream().map(Confirmation::spellStart).toList());
    }

    @Test
    void onAJournalTheDifferencesFollowFromTheRules() throws IOException {
        Path data = journalWithQuarterAverageNotices();
        byte[] journalBefore = Files.readAllBytes(data.resolve("journal.mv.db"));
        CliRun run = CliRun.of("replay", "--rules", daysPolicy.toString(), "--from-journal", data.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(Files.readAllBytes(data.resolve("journal.mv.db"))).as("the journal is opened read-only").isEqualTo(journalBefore);
        JsonNode report = JSON.readTree(run.out());
        assertThat(report.get("compared").asBoolean()).isTrue();
        assertThat(report.get("source").asText()).endsWith("journal.mv.db");

        List<String> expected = new ArrayList<>();
        Map<LocalDate, Confirmation> live = bySpell(confirmations(true));
        Map<LocalDate, Confirmation> tried = bySpell(confirmations(false));
        TreeMap<LocalDate, String> byDate = new TreeMap<>();
        for (LocalDate spell : union(live, tried)) {
            Confirmation l = live.get(spell);
            Confirmation t = tried.get(spell);
            if (t == null) {
                byDate.put(l.confirmed(), "not-at-all " + l.confirmed() + " -");
            } else if (l == null) {
                byDate.put(t.confirmed(), "extra - " + t.confirmed());
            } else {
                long days = ChronoUnit.DAYS.between(l.confirmed(), t.confirmed());
                String kind = days == 0 ? "same" : days < 0 ? "earlier" : "later";
                LocalDate from = days < 0 ? t.confirmed() : l.confirmed();
                LocalDate to = days < 0 ? l.confirmed() : t.confirmed();
                byDate.put(days < 0 ? t.confirmed() : l.confirmed(), kind + " " + l.confirmed() + " " + t.confirmed() + " "
                        + Math.abs(days) + "d " + spread.subMap(from, false, to, true).size() + "m");
            }
        }
        expected.addAll(byDate.values());
        List<String> actual = new ArrayList<>();
        for (JsonNode c : report.get("comparison")) {
            assertThat(c.get("rule").asText()).isEqualTo("inversion-confirmed");
            assertThat(c.get("subject").asText()).isEqualTo(SUBJECT);
            String kind = c.get("difference").asText();
            actual.add(switch (kind) {
                case "not-at-all" -> kind + " " + c.get("live_market_date").asText() + " -";
                case "extra" -> kind + " - " + c.get("tried_market_date").asText();
                default -> kind + " " + c.get("live_market_date").asText() + " " + c.get("tried_market_date").asText() + " "
                        + c.get("calendar_days").asLong() + "d " + c.get("market_days").asLong() + "m";
            });
        }
        assertThat(actual).isEqualTo(expected);
        assertThat(actual).as("the rules differ on this history").anyMatch(s -> !s.startsWith("same"));

        CliRun text = CliRun.of("replay", "--rules", daysPolicy.toString(), "--from-journal", data.toString());
        assertThat(text.exitCode()).as(text.err()).isZero();
        assertThat(text.out()).contains("compared with what fired").contains("inversion-confirmed  " + SUBJECT)
                .contains("Repeats are not evaluated").contains("not investment advice");
    }

    @Test
    void aDirectoryMustHoldExactlyOnePolicy() throws IOException {
        Path one = Files.createDirectories(dir.resolve("one"));
        Files.copy(daysPolicy, one.resolve("tried.yaml"));
        Files.writeString(one.resolve("README.md"), "not a policy");
        CliRun ok = CliRun.of("replay", history.toString(), "--curve", "US", "--rules", one.toString(), "--json");
        assertThat(ok.exitCode()).as(ok.err()).isZero();
        assertThat(JSON.readTree(ok.out()).get("policy").asText()).endsWith("tried.yaml");

        Files.copy(quarterPolicy, one.resolve("other.yaml"));
        CliRun two = CliRun.of("replay", history.toString(), "--curve", "US", "--rules", one.toString());
        assertThat(two.exitCode()).isEqualTo(2);
        assertThat(two.err()).contains("holds 2 policy files (other.yaml, tried.yaml)").contains("never merged");
    }

    @Test
    void misuseIsAUsageError() throws IOException {
        Path bad = dir.resolve("bad.yaml");
        Files.writeString(bad, "watch:\n  - spread: 10Y-1Y\n    confirm: [weekly-average]\n");
        CliRun invalid = CliRun.of("replay", history.toString(), "--rules", bad.toString());
        assertThat(invalid.exitCode()).isEqualTo(2);
        assertThat(invalid.err()).startsWith(bad + ":3:");

        CliRun both = CliRun.of("replay", history.toString(), "--rules", daysPolicy.toString(), "--from-journal", dir.toString());
        assertThat(both.exitCode()).isEqualTo(2);
        assertThat(both.err()).contains("give exactly one");

        CliRun replayOnly = CliRun.of("replay", history.toString(), "--rules", daysPolicy.toString(), "--persistence", "quarter-average");
        assertThat(replayOnly.exitCode()).isEqualTo(2);
        assertThat(replayOnly.err()).contains("--persistence does not apply to a what-if");

        CliRun noJournal = CliRun.of("replay", "--rules", daysPolicy.toString(), "--from-journal", dir.toString());
        assertThat(noJournal.exitCode()).isEqualTo(2);
        assertThat(noJournal.err()).contains("no journal.mv.db");
        assertThat(dir.resolve("journal.mv.db")).as("no empty journal left behind").doesNotExist();

        CliRun nothing = CliRun.of("replay");
        assertThat(nothing.exitCode()).isEqualTo(2);
        assertThat(nothing.err()).contains("give a history FILE");
    }

    // --- the oracle and the journal ---

    /**
     * The confirmed spells of 10Y−1Y under one of the two policies, month by month from the file's rows,
     * by the rule definitions in the class comment.
     */
    static List<Confirmation> confirmations(boolean quarterAverage) {
        List<Confirmation> out = new ArrayList<>();
        String state = "NORMAL";
        LocalDate spellStart = null;
        LocalDate confirmed = null;
        boolean open = false;
        int quarter = Integer.MIN_VALUE;
        double sum = 0;
        int count = 0;
        for (Map.Entry<LocalDate, Double> e : spread.entrySet()) {
            LocalDate d = e.getKey();
            double v = e.getValue();
            int q = d.getYear() * 4 + (d.getMonthValue() - 1) / 3;
            if (q != quarter) {
                if (quarterAverage && count > 0 && state.equals("INVERTED") && sum / count < 0) {
                    state = "CONFIRMED";
                    confirmed = d;
                }
                quarter = q;
                sum = 0;
                count = 0;
            }
            sum += v;
            count++;
            if (state.equals("NORMAL") || state.equals("RESTEEPENING")) {
                if (v < 0) {
                    state = "INVERTED";
                    spellStart = d;
                }
            } else if (v >= 0) {
                state = state.equals("CONFIRMED") ? "RESTEEPENING" : "NORMAL";
            } else if (!quarterAverage && state.equals("INVERTED") && ChronoUnit.DAYS.between(spellStart, d) >= 90) {
                state = "CONFIRMED";
                confirmed = d;
            }
            // the alert rule, evaluated after the step
            if (state.equals("CONFIRMED") && !open) {
                open = true;
                out.add(new Confirmation(spellStart, confirmed, null));
            } else if (!state.equals("CONFIRMED") && open) {
                open = false;
                Confirmation c = out.remove(out.size() - 1);
                out.add(new Confirmation(c.spellStart(), c.confirmed(), d));
            }
        }
        return out;
    }

    /**
     * A daemon's data directory with an H2 journal: the file's months taken by the real pipeline as curve US, and the
     * notices the quarter-average policy fired on them (from {@link #confirmations}), stored as the daemon stores them.
     */
    private Path journalWithQuarterAverageNotices() throws IOException {
        Path data = Files.createDirectories(dir.resolve("data"));
        Clock clock = Clock.fixed(Instant.parse("2030-01-01T00:00:00Z"), ZoneOffset.UTC);
        // no user name: the daemon's default journal has none
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:file:" + data.toAbsolutePath().resolve("journal"), null, null, 2)) {
            QuotePipeline pipeline = new QuotePipeline(PolicyParser.parse(quarterPolicy.toString(), Files.readString(quarterPolicy)).watches(),
                    new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE, clock);
            List<String> lines = Files.readAllLines(history);
            for (String line : lines.subList(1, lines.size())) {
                String[] f = line.split(",");
                Map<Tenor, Double> yields = Map.of(Tenor.years(1), Double.parseDouble(f[1]) * 100, Tenor.years(3), Double.parseDouble(f[2]) * 100,
                        Tenor.years(5), Double.parseDouble(f[3]) * 100, Tenor.years(10), Double.parseDouble(f[4]) * 100);
                pipeline.process(List.of(new QuoteBatch("test", List.of(QuoteMessage.of("US", LocalDate.parse(f[0]), yields)), List.of())));
            }
            JournalEntries notices = new JournalEntries();
            for (Confirmation c : confirmations(true)) {
                notices.alert(notice(Alert.Kind.FIRING, c.confirmed(), c.confirmed(), 1));
                if (c.resolved() != null) {
                    notices.alert(notice(Alert.Kind.RESOLVED, c.confirmed(), c.resolved(), 2));
                }
            }
            new JournalWriter(ds, clock).write(notices);
        } catch (org.slopewatch.rules.PolicyException e) {
            throw new IllegalStateException(e);
        }
        return data;
    }

    private static JournalEntries.AlertEntry notice(Alert.Kind kind, LocalDate since, LocalDate on, int number) {
        String id = AlertEngine.id("inversion-confirmed", SUBJECT, since, number);
        Alert alert = new Alert(id, "inversion-confirmed", Severity.CRITICAL, kind, SUBJECT, on, kind == Alert.Kind.FIRING ? "CONFIRMED"
                : "RESTEEPENING", "[CRITICAL] US 10Y-1Y", "inversion-confirmed on " + on, List.of(), null,
                on.atStartOfDay(ZoneOffset.UTC).toInstant());
        return new JournalEntries.AlertEntry(alert, SUBJECT, since, number, null, "quarter-average-policy", null, List.of());
    }

    private static Map<LocalDate, Confirmation> bySpell(List<Confirmation> confirmations) {
        Map<LocalDate, Confirmation> out = new TreeMap<>();
        confirmations.forEach(c -> out.put(c.spellStart(), c));
        return out;
    }

    private static List<LocalDate> union(Map<LocalDate, Confirmation> a, Map<LocalDate, Confirmation> b) {
        java.util.TreeSet<LocalDate> all = new java.util.TreeSet<>(a.keySet());
        all.addAll(b.keySet());
        return List.copyOf(all);
    }

    private static Path resource(String name) throws Exception {
        return Path.of(WhatIfCommandTest.class.getClassLoader().getResource(name).toURI());
    }
}
