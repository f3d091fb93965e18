package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.tuple;

import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.Acknowledgements;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.journal.DeliveryOutbox;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalRange;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.journal.NewestAlerts;
import org.slopewatch.journal.PolicyVersions;
import org.slopewatch.journal.TimelineRows;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.Watch;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Severity;
import org.slopewatch.spread.SpreadDefinition;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.testsupport.MutableClock;

/**
 * As-of reads of the journal, the same checks on H2 ({@link AsOfJournalTest}) and PostgreSQL
 * ({@link AsOfJournalPostgresTest}): the journal is written by the real pipeline with a clock the
 * test moves, so every row's recorded time is known.
 *
 * <p>Scenario and source of the expectations: GOVT-A's 10Y−3M is −20 bp on every business day of
 * the first quarter of 2026 and on 1 April, recorded at {@link #T1}; the rule watched is "enter
 * below 0 bp, confirm when a complete calendar quarter averages below 0 bp", so the monitor must
 * go INVERTED on the first date (2 January) and CONFIRMED on the first date after the quarter
 * (1 April). At {@link #T3} a revision sets 2 January to +30 bp: the inversion now starts on the
 * next business day (5 January) and the quarter still averages below zero, so both transitions
 * are replaced (the journal supersedes every transition from the revised date on) by INVERTED on
 * 5 January and CONFIRMED on 1 April. Asked about a moment between, the journal must answer as
 * it stood before the revision.
 */
abstract class AsOfJournalChecks {

    static final Instant T1 = Instant.parse("2026-04-02T10:00:00Z");
    static final Instant T2 = T1.plus(Duration.ofHours(1));
    static final Instant T3 = T1.plus(Duration.ofHours(2));
    static final Instant BETWEEN = T1.plus(Duration.ofMinutes(30));
    static final SpreadKey KEY = new SpreadKey("GOVT-A", "10Y-3M");
    static final List<Watch> WATCHES = List.of(new Watch(SpreadDefinition.parse("10Y-3M"),
            new MonitorDefinition(0, 5, 2, 60, List.of(new QuarterAverage(0))), Set.of()));

    private final List<AutoCloseable> open = new ArrayList<>();
    // every journal row gets the time the scenario says
    private final MutableClock clock = new MutableClock(T1.minus(Duration.ofHours(1)));
    private AgroalDataSource ds;
    private QuotePipeline pipeline;
    private JournalReader reader;
    private PolicyVersions policies;
    private AlertHistory history;
    private NewestAlerts newest;
    private TimelineRows timeline;
    private SpreadStatus liveAtT1;
    private int businessDays;

    /** A new, empty, migrated journal, kept apart from every other one. */
    protected abstract AgroalDataSource database();

    protected final <T extends AutoCloseable> T closeAfterTest(T resource) {
        open.add(resource);
        return resource;
    }

    @AfterEach
    void close() throws Exception {
        Collections.reverse(open);
        for (AutoCloseable c : open) {
            c.close();
        }
        open.clear();
    }

    @BeforeEach
    void writeTheScenario() {
        ds = database();
        reader = new JournalReader(ds);
        policies = new PolicyVersions(ds, clock);
        history = new AlertHistory(ds);
        newest = new NewestAlerts(ds);
        timeline = new TimelineRows(ds);
        pipeline = new QuotePipeline(WATCHES, new JournalWriter(ds, clock), reader, PipelineListener.NONE, clock);
        pipeline.recover();
        policies.policyVersion("rules-one", "policy.yaml", "applied", "loaded at start-up");

        clock.set(T1);
        List<QuoteMessage> quarter = new ArrayList<>();
        for (LocalDate d = LocalDate.of(2026, 1, 2); !d.isAfter(LocalDate.of(2026, 4, 1)); d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                quarter.add(snapshot(d, -20));
            }
        }
        businessDays = quarter.size();
        pipeline.process(List.of(new QuoteBatch("test", quarter, List.of())));
        liveAtT1 = pipeline.spread(KEY);

        clock.set(T2);
        pipeline.process(List.of(new QuoteBatch("test", List.of(), List.of(new Reject(RejectReason.MALFORMED, "not valid JSON", 0, "{")))));
        policies.policyVersion("rules-broken", "policy.yaml", "rejected", "policy.yaml:3:1: unknown key");

        clock.set(T3);
        pipeline.process(List.of(new QuoteBatch("test", List.of(snapshot(LocalDate.of(2026, 1, 2), 30)), List.of())));
        policies.policyVersion("rules-two", "policy.yaml", "applied", "reloaded");
    }

    private static QuoteMessage snapshot(LocalDate date, double spreadBp) {
        return QuoteMessage.of("GOVT-A", date, Map.of(Tenor.months(3), 500.0, Tenor.years(10), 500.0 + spreadBp));
    }

    private static JournalRange range(Instant asOf) {
        return new JournalRange(KEY.id(), LocalDate.of(2026, 1, 1), LocalDate.of(2026, 12, 31), asOf);
    }

    @Test
    void beforeTheRevisionItsReplacedTransitionsStandAndItsNewOnesAreAbsent() {
        List<JournalReader.StoredTransition> standingThen = reader.transitions(range(BETWEEN), false, 100);
        assertThat(standingThen).extracting(JournalReader.StoredTransition::date, JournalReader.StoredTransition::to,
                        JournalReader.StoredTransition::supersededBy)
                .as("inverted from the first date, confirmed on the first date after the quarter, nothing superseded yet")
                .containsExactly(tuple(LocalDate.of(2026, 1, 2), "INVERTED", null), tuple(LocalDate.of(2026, 4, 1), "CONFIRMED", null));
        assertThat(reader.transitions(range(BETWEEN), true, 100)).as("the revision's transitions were not recorded yet")
                .isEqualTo(standingThen);
        assertThat(reader.transitions(range(T1.minusSeconds(1)), true, 100)).as("nothing recorded before T1").isEmpty();
    }

    @Test
    void afterTheRevisionTheOldTransitionsAreSupersededAndTheNewOnesStand() {
        assertThat(reader.transitions(range(null), false, 100))
                .extracting(JournalReader.StoredTransition::date, JournalReader.StoredTransition::to)
                .as("2 January is now positive: inverted from 5 January")
                .containsExactly(tuple(LocalDate.of(2026, 1, 5), "INVERTED"), tuple(LocalDate.of(2026, 4, 1), "CONFIRMED"));
        assertThat(reader.transitions(range(T3), false, 100)).as("at the revision's own time it counts (at or before)")
                .isEqualTo(reader.transitions(range(null), false, 100));
        List<JournalReader.StoredTransition> all = reader.transitions(range(null), true, 100);
        assertThat(all).hasSize(4);
        assertThat(all).filteredOn(t -> t.recordedAt().equals(T1)).as("both of T1's transitions replaced")
                .allSatisfy(t -> assertThat(t.supersededBy()).isNotNull());
        assertThat(all).filteredOn(t -> t.recordedAt().equals(T3)).allSatisfy(t -> assertThat(t.supersededBy()).isNull());
    }

    @Test
    void theStandingValueOfADateIsTheLastRecordedByTheMomentAsked() throws IOException {
        LocalDate jan2 = LocalDate.of(2026, 1, 2);
        assertThat(reader.history(KEY.id(), jan2, jan2, BETWEEN)).extracting(JournalReader.HistoryPoint::valueBp).containsExactly(-20.0);
        assertThat(reader.history(KEY.id(), jan2, jan2, null)).extracting(JournalReader.HistoryPoint::valueBp).containsExactly(30.0);
        assertThat(reader.history(KEY.id(), jan2, jan2, T1.minusSeconds(1))).isEmpty();

        List<JournalReader.StoredObservation> then = reader.observations(range(BETWEEN), 10_000);
        assertThat(then).hasSize(businessDays).allSatisfy(o -> assertThat(o.standing()).isTrue());
        List<JournalReader.StoredObservation> now = reader.observations(range(null), 10_000);
        assertThat(now).hasSize(businessDays + 1);
        assertThat(now).filteredOn(o -> o.date().equals(jan2))
                .extracting(JournalReader.StoredObservation::valueBp, JournalReader.StoredObservation::standing)
                .as("both values of 2 January kept, the later one standing").containsExactly(tuple(-20.0, false), tuple(30.0, true));
        assertThat(reader.observations(range(null), 3)).as("a limit is a limit, look-ahead or not").isEqualTo(now.subList(0, 3));

        List<JournalReader.StoredObservation> streamed = new ArrayList<>();
        reader.eachObservation(range(null), streamed::add);
        assertThat(streamed).as("the cursor gives what the list gives").isEqualTo(now);
        List<JournalReader.StoredTransition> transitions = new ArrayList<>();
        reader.eachTransition(range(BETWEEN), transitions::add);
        assertThat(transitions).isEqualTo(reader.transitions(range(BETWEEN), true, 100));
    }

    @Test
    void rejectsAndTheRuleSetInForceAreReadAsOfTheMoment() {
        assertThat(reader.rejects(10, BETWEEN)).isEmpty();
        assertThat(reader.rejects(10, T2)).extracting(JournalReader.StoredReject::detail).containsExactly("not valid JSON");
        assertThat(policies.policyHashAt(T1.minus(Duration.ofHours(2)))).as("before the first policy was journalled").isNull();
        assertThat(policies.policyHashAt(BETWEEN)).isEqualTo("rules-one");
        assertThat(policies.policyHashAt(T2)).as("a rejected policy never comes into force").isEqualTo("rules-one");
        assertThat(policies.policyHashAt(T3)).isEqualTo("rules-two");
    }

    @Test
    void theMonitorStateAsOfAMomentIsWhatTheLivePipelineHeldThen() {
        AsOfRebuild rebuild = new AsOfRebuild(reader);
        AsOfRebuild.Rebuilt then = rebuild.spread(KEY, BETWEEN, WATCHES);
        assertThat(then.quotes()).isEqualTo(businessDays);
        assertThat(then.status()).as("rebuilt from the journal = what the pipeline reported at T1").isEqualTo(liveAtT1);
        assertThat(then.status().openSpell().start()).isEqualTo(LocalDate.of(2026, 1, 2));
        AsOfRebuild.Rebuilt now = rebuild.spread(KEY, T3, WATCHES);
        assertThat(now.status()).isEqualTo(pipeline.spread(KEY));
        assertThat(now.status().openSpell().start()).isEqualTo(LocalDate.of(2026, 1, 5));
        assertThat(rebuild.spread(KEY, T1.minusSeconds(1), WATCHES).status()).as("no value recorded yet").isNull();
        assertThat(rebuild.spread(new SpreadKey("GOVT-B", "10Y-3M"), T3, WATCHES).quotes()).as("only the spread's curve is replayed")
                .isZero();
    }

    @Test
    void aDeliveryAsOfAMomentIsReplayedFromTheAttemptsRecordedByThen() {
        String id = "inversion-confirmed~GOVT-A:10Y-3M~2026-04-01~1";
        Alert alert = new Alert(id, "inversion-confirmed", Severity.CRITICAL, Alert.Kind.OPENING, KEY.id(), LocalDate.of(2026, 4, 1),
                "CONFIRMED", "GOVT-A:10Y-3M confirmed inverted at -21.0 bp \u2014 opening notice, critical", "confirmed, with a comma\nand a line\n\n" + Alert.CAUTION, List.of(),
                "http://localhost:8080/", T1);
        JournalEntries e = new JournalEntries();
        e.alert(new JournalEntries.AlertEntry(alert, KEY.id(), LocalDate.of(2026, 4, 1), 1, null, "rules-one", 62L,
                List.of(new JournalEntries.Outbox("desk-chat", null), new JournalEntries.Outbox("risk-email", "not configured"))));
        clock.set(T1.plusSeconds(1));
        new JournalWriter(ds, clock).write(e);
        Instant tried = T1.plus(Duration.ofMinutes(10));
        Instant delivered = T1.plus(Duration.ofMinutes(40));
        DeliveryOutbox outbox = new DeliveryOutbox(ds, clock);
        DeliveryOutbox.Delivery pending = outbox.due("desk-chat", T1.plusSeconds(1), 10).get(0).delivery();
        clock.set(tried);
        outbox.attempt(pending, tried, "retry", "HTTP 503", "retry in 30m", DeliveryOutbox.Status.PENDING, delivered);
        clock.set(delivered);
        outbox.attempt(outbox.due("desk-chat", delivered, 10).get(0).delivery(), delivered, "delivered", "HTTP 200",
                "delivered on attempt 2", DeliveryOutbox.Status.DELIVERED, null);
        clock.set(delivered.plus(Duration.ofMinutes(10)));
        new Acknowledgements(ds, clock).ack(id, "desk-lead", "seen");

        assertThat(newest.page(10, T1, null)).as("not recorded yet at T1").isEmpty();
        assertThat(chat(newest.page(10, T1.plusSeconds(1), null).get(0)))
                .as("as written: due at once, never tried")
                .isEqualTo(new DeliveryOutbox.Delivery(id, "desk-chat", DeliveryOutbox.Status.PENDING, 0, T1, null, null, T1.plusSeconds(1)));
        assertThat(chat(newest.page(10, BETWEEN, null).get(0)))
                .as("after the 503: pending, one attempt; when the retry was due is kept only in the current row")
                .isEqualTo(new DeliveryOutbox.Delivery(id, "desk-chat", DeliveryOutbox.Status.PENDING, 1, null, tried, "retry in 30m", tried));
        AlertHistory.AlertView later = newest.page(10, delivered.plus(Duration.ofMinutes(5)), null).get(0);
        assertThat(chat(later)).as("replayed to the end it is the stored row").isEqualTo(chat(history.find(id)));
        assertThat(later.deliveries()).filteredOn(d -> d.channel().equals("risk-email")).extracting(DeliveryOutbox.Delivery::status)
                .containsExactly(DeliveryOutbox.Status.SKIPPED);
        assertThat(later.acks()).as("acknowledged afterwards").isEmpty();
        assertThat(newest.page(10, Instant.parse("2030-01-01T00:00:00Z"), null).get(0).acks()).extracting(AlertHistory.Ack::by)
                .containsExactly("desk-lead");

        assertThat(timeline.alerts(range(BETWEEN), null, 10)).extracting(r -> r.value().stored().alert().id()).containsExactly(id);
        assertThat(timeline.alerts(new JournalRange(KEY.id(), LocalDate.of(2026, 5, 1), LocalDate.of(2026, 5, 31), null), null, 10))
                .as("outside the market-date range").isEmpty();
        assertThat(new DeliveryAttempts(ds).attempts(List.of(id), BETWEEN)).extracting(DeliveryAttempts.StoredAttempt::outcome).containsExactly("retry");
        List<String> exported = new ArrayList<>();
        try {
            history.eachAlert(range(null), a -> exported.add(a.alert().text()));
        } catch (IOException ex) {
            throw new AssertionError(ex);
        }
        assertThat(exported).containsExactly(alert.text());
    }

    private static DeliveryOutbox.Delivery chat(AlertHistory.AlertView v) {
        return v.deliveries().stream().filter(d -> d.channel().equals("desk-chat")).findFirst().orElseThrow();
    }
}
