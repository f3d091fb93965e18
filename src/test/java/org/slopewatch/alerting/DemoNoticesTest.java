package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collection;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.slopewatch.ingest.demo.DemoFeed;
import org.slopewatch.ingest.demo.DemoScenario;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.pipeline.CurveOwnership;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertConditions;
import org.slopewatch.rules.AlertDecision;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.rules.AlertTrigger;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.testsupport.MutableClock;

/**
 * Every notice of the demo scenario (seed 1, from Monday 2026-01-05, under the shipped policy)
 * says the same as the journal: its subject and body are read back from the journal and checked
 * against the journalled transition it reports, and the journalled observations of its date.
 * The same spread, the same state, the same value at the written precision (one decimal), the
 * same spell start date and the same count of days; a notice that names another count (a spell's
 * length where the confirmation counted days without a break, say) fails here.
 *
 * <p>The notices are decided and written as {@link AlertDesk} does (conditions from each status
 * the pipeline hands over, {@link AlertEngine}, {@link AlertComposer} with the policy's
 * probability), journalled in the step's transaction; the wall clock moves an hour per business
 * day, so the daily standing notices come every 24 business days.
 *
 * <p>What is checked against what: the transition's evidence (the {@code days-inverted} test's
 * count and the first date it counts from, the value on the transition's date), the spell's
 * entry transition (its start), the spell's exit transition (its length, in its reason), and for a
 * standing notice the journalled observations, from which the run below the entry threshold is
 * counted again here independently.
 */
class DemoNoticesTest {

    private static final LocalDate START = LocalDate.of(2026, 1, 5);
    /** The scripted inversion and re-steepening of GOVT-A, and the year of hold after it. */
    private static final int DAYS = 800;
    private static final Pattern VALUE_IN_SUBJECT = Pattern.compile(" at (-?\\d+\\.\\d) bp");
    private static final Pattern SPELL_START = Pattern.compile("(?:spell began on|spell start: |spell: )(\\d{4}-\\d\\d-\\d\\d)");
    private static final Pattern DAY_COUNT = Pattern.compile("(?<![\\d.-])(\\d+) days?\\b|days inverted: (\\d+)");
    private static final Pattern RUN_START = Pattern.compile("without a break since (\\d{4}-\\d\\d-\\d\\d)");

    private static AgroalDataSource ds;
    private static Policy policy;
    private static List<AlertHistory.StoredAlert> notices;
    private static List<JournalReader.StoredTransition> transitions;
    private static JournalReader reader;

    @BeforeAll
    static void playTheDemoWithAlerts() throws Exception {
        Path file = Path.of("alert-rules/default.yaml");
        policy = PolicyParser.parse(file.toString(), Files.readAllBytes(file));
        ds = JournalDatabase.open("jdbc:h2:mem:demo-notices-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2);
        MutableClock clock = new MutableClock(Instant.parse("2026-01-05T17:00:00Z"));
        Stage stage = new Stage(policy, clock);
        QuotePipeline pipeline = new QuotePipeline(policy.watches(), new JournalWriter(ds, clock), new JournalReader(ds),
                PipelineListener.NONE, stage, clock);
        pipeline.recover();
        new DemoFeed(DemoScenario.standard(1, START)).play(null, DAYS, day -> {
            clock.advance(Duration.ofHours(1));
            pipeline.tick(Map.of(), CurveOwnership.ALL);
        }, b -> pipeline.process(List.of(b)));
        notices = new AlertHistory(ds).notices(EnumSet.allOf(Alert.Kind.class));
        reader = new JournalReader(ds);
        transitions = reader.transitions(null, LocalDate.of(2000, 1, 1), LocalDate.of(2100, 1, 1), false, 100_000);
    }

    @AfterAll
    static void close() {
        ds.close();
    }

    @Test
    void theDemoSendsEveryKindOfNoticeForTheConfirmedInversion() {
        Map<Alert.Kind, Long> kinds = notices.stream().filter(n -> n.alert().rule().equals("inversion-confirmed")
                && n.subject().equals("GOVT-A:10Y-3M")).collect(Collectors.groupingBy(n -> n.alert().kind(), Collectors.counting()));
        assertThat(kinds).as("opening, standing and closing notices of inversion-confirmed on GOVT-A:10Y-3M")
                .containsEntry(Alert.Kind.OPENING, 1L).containsEntry(Alert.Kind.CLOSING, 1L);
        assertThat(kinds.get(Alert.Kind.STANDING)).as("standing notices, daily on a clock that moves an hour per business day")
                .isGreaterThan(5);
        assertThat(notices).extracting(n -> n.alert().rule()).contains("first-inversion", "resteepening");
    }

    @Test
    void everyNoticeAgreesWithTheJournalledTransitionItReports() {
        List<String> disagreements = new ArrayList<>();
        for (AlertHistory.StoredAlert n : notices) {
            disagreements.addAll(check(n));
        }
        assertThat(disagreements).as("notices whose figures differ from the journal's (%d notices read)", notices.size()).isEmpty();
    }

    /**
     * The probability a notice states is one figure: where its body states one, its fact says the
     * same sentence, and it is the final value of the last complete month (the sentence itself is
     * checked against Commons Math in ProbabilityTextTest and against posted quotes in
     * DashboardBrowserTest).
     */
    @Test
    void aNoticeStatesTheProbabilityOnceAndAsTheModelGivesIt() {
        List<String> disagreements = new ArrayList<>();
        int checked = 0;
        for (AlertHistory.StoredAlert n : notices) {
            for (Alert.Fact f : n.alert().facts()) {
                if (!f.label().equals("recession probability")) {
                    continue;
                }
                if (!f.value().contains("(complete month, ")) {
                    disagreements.add(n.alert().id() + ": not the last complete month's: " + f.value());
                }
                if (n.alert().text().contains("recession probability")) {
                    checked++;
                    if (!n.alert().text().contains(f.value())) {
                        disagreements.add(n.alert().id() + ": the body does not say the fact's '" + f.value() + "'");
                    }
                }
            }
        }
        assertThat(checked).as("notices that state a probability in their body (confirmations of 10Y-3M, which the shipped policy models)").isPositive();
        assertThat(disagreements).isEmpty();
    }

    /** Every way a notice differs from the journal, each as a line naming the notice. */
    private static List<String> check(AlertHistory.StoredAlert n) {
        Alert a = n.alert();
        String subject = a.subject();
        String body = a.text().replace(Alert.CAUTION, "");
        String facts = a.facts().stream().map(f -> f.label() + ": " + f.value()).collect(Collectors.joining("\n"));
        String all = subject + "\n" + body + "\n" + facts;
        String spread = n.subject();
        AlertTrigger.EntersState when = (AlertTrigger.EntersState) policy.alerts().stream().filter(r -> r.name().equals(a.rule()))
                .findFirst().orElseThrow().when();
        Expected expected = expected(n, when);
        List<String> out = new ArrayList<>();
        String who = a.id() + " (" + subject + ")";
        if (!subject.startsWith(spread + " ") || !body.contains(spread)) {
            out.add(who + ": does not name " + spread + " in its subject and body");
        }
        String stateWords = words(expected.state());
        if (!subject.contains(stateWords) || !a.state().equals(expected.state())) {
            out.add(who + ": state " + a.state() + " where the journal has " + expected.state());
        }
        Matcher value = VALUE_IN_SUBJECT.matcher(subject);
        String written = String.format(Locale.ROOT, "%.1f", expected.valueBp());
        if (!value.find() || !value.group(1).equals(written)) {
            out.add(who + ": value in the subject is not the journal's " + written + " bp");
        }
        if (!all.contains(written + " bp on " + expected.date())) {
            out.add(who + ": does not give the value " + written + " bp with its date " + expected.date());
        }
        for (String start : all(SPELL_START, all)) {
            if (!start.equals(String.valueOf(expected.spellStart()))) {
                out.add(who + ": spell start " + start + " where the journal's spell began " + expected.spellStart());
            }
        }
        if (expected.spellStart() != null && all(SPELL_START, all).isEmpty()) {
            out.add(who + ": does not give the spell's start " + expected.spellStart());
        }
        for (String count : all(DAY_COUNT, all)) {
            if (!count.equals(String.valueOf(expected.days()))) {
                out.add(who + ": counts " + count + " days where the journal counts " + expected.days());
            }
        }
        if (expected.days() != null && all(DAY_COUNT, all).isEmpty()) {
            out.add(who + ": gives no count of days (the journal's: " + expected.days() + ")");
        }
        for (String since : all(RUN_START, all)) {
            if (!since.equals(String.valueOf(expected.runStart()))) {
                out.add(who + ": inverted without a break since " + since + " where the journal's run began " + expected.runStart());
            }
        }
        return out;
    }

    /**
     * What the journal says a notice reports: the opening notice its rule's transition (into the
     * rule's state, on the episode's first date), a closing notice the transition out of it (on the
     * notice's market date), a standing notice the state as the observations of its date leave it.
     */
    private static Expected expected(AlertHistory.StoredAlert n, AlertTrigger.EntersState when) {
        String spread = n.subject();
        String state = when.state().name();
        LocalDate date = n.alert().marketDate();
        return switch (n.alert().kind()) {
            case OPENING -> {
                JournalReader.StoredTransition t = one(spread, date, null, state);
                yield fromTransition(t, t.to());
            }
            case CLOSING -> {
                JournalReader.StoredTransition t = one(spread, date, state, null);
                yield fromTransition(t, t.to());
            }
            case STANDING -> standing(spread, date, state);
        };
    }

    private static Expected fromTransition(JournalReader.StoredTransition t, String state) {
        LocalDate spellStart = spellStart(t);
        return switch (t.test()) {
            // the confirmation counted days below the entry threshold without a break, from the date its window names
            case "days-inverted" -> new Expected(state, t.date(), t.valueBp(), spellStart, t.daysInverted(),
                    LocalDate.parse(t.window().substring("since ".length())));
            // the spell's exit: its length in calendar days is in the reason ("... spell of N days ended")
            case "exit" -> new Expected(state, t.date(), t.valueBp(), spellStart, lengthInReason(t.reason()), null);
            // a spell's first day: below the entry threshold since that day, for 0 days
            case "entry" -> new Expected(state, t.date(), t.valueBp(), t.date(), 0L, t.date());
            // another confirmation: the days below the entry threshold without a break up to its date
            default -> new Expected(state, t.date(), t.valueBp(), spellStart, t.daysInverted(),
                    t.daysInverted() > 0 ? t.date().minusDays(t.daysInverted()) : null);
        };
    }

    /** A standing notice: the state entered before its date, and the run below 0 bp counted from the journalled observations. */
    private static Expected standing(String spread, LocalDate date, String state) {
        List<JournalReader.HistoryPoint> points = reader.history(spread, LocalDate.of(2000, 1, 1), date);
        JournalReader.HistoryPoint last = points.get(points.size() - 1);
        assertThat(last.date()).isEqualTo(date);
        LocalDate runStart = null;
        for (int i = points.size() - 1; i >= 0 && points.get(i).valueBp() < 0; i--) {
            runStart = points.get(i).date();     // the shipped policy enters below 0 bp
        }
        JournalReader.StoredTransition entered = transitions.stream().filter(t -> t.spreadId().equals(spread) && t.to().equals(state)
                && !t.date().isAfter(date)).reduce((x, y) -> y).orElseThrow();
        return new Expected(state, date, last.valueBp(), spellStart(entered), runStart == null ? 0
                : java.time.temporal.ChronoUnit.DAYS.between(runStart, date), runStart);
    }

    /** The date of the entry transition of the transition's spell. */
    private static LocalDate spellStart(JournalReader.StoredTransition t) {
        return transitions.stream().filter(x -> x.spreadId().equals(t.spreadId()) && x.spellId() == t.spellId()
                && x.to().equals("INVERTED")).map(JournalReader.StoredTransition::date).reduce((x, y) -> y).orElse(null);
    }

    private static JournalReader.StoredTransition one(String spread, LocalDate date, String from, String to) {
        List<JournalReader.StoredTransition> found = transitions.stream().filter(t -> t.spreadId().equals(spread) && t.date().equals(date)
                && (from == null || t.from().equals(from)) && (to == null || t.to().equals(to))).toList();
        assertThat(found).as("the journalled transition of %s on %s (%s -> %s)", spread, date, from, to).hasSize(1);
        return found.get(0);
    }

    private static Long lengthInReason(String reason) {
        Matcher m = Pattern.compile("spell of (\\d+) days ended").matcher(reason);
        assertThat(m.find()).as("the exit transition's reason names the spell's length: %s", reason).isTrue();
        return Long.parseLong(m.group(1));
    }

    private static String words(String state) {
        return switch (state) {
            case "CONFIRMED" -> "confirmed inverted";
            case "RESTEEPENING" -> "re-steepening";
            default -> state.toLowerCase(Locale.ROOT);
        };
    }

    private static List<String> all(Pattern p, String text) {
        List<String> out = new ArrayList<>();
        Matcher m = p.matcher(text);
        while (m.find()) {
            for (int g = 1; g <= m.groupCount(); g++) {
                if (m.group(g) != null) {
                    out.add(m.group(g));
                }
            }
        }
        return out;
    }

    /**
     * @param days     the count of days the notice must give (days without a break, or a spell's length), null for none
     * @param runStart the first date of the run below the entry threshold, when the notice must name one
     */
    private record Expected(String state, LocalDate date, double valueBp, LocalDate spellStart, Long days, LocalDate runStart) {
    }

    /** The alert stage of the test: {@link AlertDesk}'s decision and composition, without quiet periods or delivery. */
    private static final class Stage implements AlertStage {

        private final Policy policy;
        private final MutableClock clock;
        private final AlertEngine engine;
        private final AlertComposer composer = new AlertComposer("http://localhost:8080/");

        Stage(Policy policy, MutableClock clock) {
            this.policy = policy;
            this.clock = clock;
            this.engine = new AlertEngine(policy.alerts());
        }

        @Override
        public void onStep(Collection<SpreadStatus> changed, long sequence, JournalEntries journal) {
            decide(List.copyOf(changed), sequence, journal);
        }

        @Override
        public void onTick(Collection<SpreadStatus> all, Map<String, LocalDate> staleCurves, JournalEntries journal) {
            decide(List.copyOf(all), null, journal);
        }

        private void decide(List<SpreadStatus> statuses, Long sequence, JournalEntries journal) {
            Instant now = clock.instant();
            Map<String, SpreadStatus> byId = new HashMap<>();
            statuses.forEach(s -> byId.put(s.id(), s));
            for (AlertDecision d : engine.decide(AlertConditions.of(policy.alerts(), statuses, Map.of(),
                    policy.probability()), now)) {
                SpreadStatus status = byId.get(d.subject());
                Alert alert = composer.compose(d, status, policy.probability().quoted(d.rule().when(), status).orElse(null), now);
                journal.alert(new JournalEntries.AlertEntry(alert, d.subject(), d.since(), d.number(), null, "test", sequence, List.of()));
            }
        }

        @Override
        public void written(List<JournalEntries.AlertEntry> alerts) {
        }

        @Override
        public void rebuild() {
        }
    }
}
