package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import jakarta.inject.Inject;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.delivery.ChannelRegistry;
import org.slopewatch.journal.Acknowledgements;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeskChanges;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.journal.QuietPeriodBook;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.rules.PolicyHash;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.testsupport.MutableClock;

/**
 * Two instances on one journal, as several daemons on one Kafka consumer group run: each has its
 * own pipeline and alert desk, instance A answers for GOVT-A and instance B for GOVT-B. A quiet
 * period, a lift or an acknowledgement made through A must hold for the very next notice B
 * decides, without B restarting. Written once and run on H2 ({@link DeskAcrossInstancesTest}) and
 * PostgreSQL ({@link DeskAcrossInstancesPostgresTest}).
 *
 * <p>The desks are built by hand on the test's journal; the channels, dispatcher and metrics are
 * the test application's (only the {@code log} channel is used, and whether a notice is held back
 * is read from the journal, not from a delivery).
 *
 * <p>What is expected follows from the policy below and the documented meaning of its keys
 * (docs/policy.md): {@code enters-state: INVERTED} opens an episode on the first quote with 10Y
 * below 3M, {@code standing-every: 1h} repeats it each wall-clock hour, an acknowledgement stops the
 * repeats but not the closing notice, which takes the next notice number.
 */
abstract class DeskAcrossInstancesChecks {

    private static final String POLICY = """
            watch:
              - spread: 10Y-3M
                enter-below-bp: 0
                exit-at-or-above-bp: 5
                exit-after-observations: 1
                hold-days: 365
                confirm:
                  - days-inverted: { days: 90 }
            alerts:
              - name: below-zero
                when: { enters-state: INVERTED }
                severity: warning
                channels: [log]
                standing-every: 1h
                closing-notice: true
                message: "{curve} {spread} below zero ({value} bp)"
            """;
    private static final String SUBJECT = "GOVT-B:10Y-3M";
    private static final LocalDate DAY = LocalDate.of(2026, 3, 2);
    private static final Instant T0 = Instant.parse("2026-03-02T21:00:00Z");

    @Inject
    ChannelRegistry channels;
    @Inject
    AlertDispatcher dispatcher;
    @Inject
    AlertMetrics metrics;
    @Inject
    AlertsConfig config;

    private final List<AutoCloseable> open = new ArrayList<>();
    private final MutableClock clock = new MutableClock(T0);
    private PolicyHolder policies;
    private AgroalDataSource first;
    private AgroalDataSource second;
    private int messages;

    /**
     * Two connection pools on one new, empty journal, as two daemons would open it. Register what
     * must be closed with {@link #closeAfterTest}.
     */
    protected abstract List<AgroalDataSource> oneJournalTwice();

    protected final <T extends AutoCloseable> T closeAfterTest(T resource) {
        open.add(resource);
        return resource;
    }

    @BeforeEach
    void journal() throws Exception {
        byte[] bytes = POLICY.getBytes(StandardCharsets.UTF_8);
        policies = new PolicyHolder(new PolicyHolder.Loaded(PolicyParser.parse("desk.yaml", bytes), PolicyHash.of(bytes), "desk.yaml"));
        List<AgroalDataSource> pools = oneJournalTwice();
        first = pools.get(0);
        second = pools.get(1);
    }

    @AfterEach
    void close() throws Exception {
        Collections.reverse(open);
        for (AutoCloseable c : open) {
            c.close();
        }
        open.clear();
    }

    /** One daemon: its own desk and pipeline on its own pool, rebuilt from the journal as at start. */
    private final class Instance {
        final AlertDesk desk;
        final QuotePipeline pipeline;
        final String curve;

        Instance(AgroalDataSource ds, String curve) {
            this.curve = curve;
            desk = new AlertDesk(policies, new AlertHistory(ds), new Acknowledgements(ds, clock), new QuietPeriodBook(ds, clock),
                    new DeskChanges(ds), channels, dispatcher, metrics, config, clock);
            pipeline = new QuotePipeline(policies.policy().watches(), new JournalWriter(ds, clock), new JournalReader(ds),
                    PipelineListener.NONE, desk, clock);
            pipeline.recover();
        }

        void quote(LocalDate date, double threeMonth, double tenYear) {
            pipeline.process(List.of(new QuoteBatch("test", List.of(new QuoteMessage("q" + (messages++), "test", null, curve, date,
                    new TreeMap<>(Map.of(Tenor.months(3), threeMonth, Tenor.years(10), tenYear)))), List.of())));
        }

        void tick() {
            pipeline.tick(Map.of(), c -> c.equals(curve));
        }
    }

    private Instance instanceA() {
        return new Instance(first, "GOVT-A");
    }

    private Instance instanceB() {
        return new Instance(second, "GOVT-B");
    }

    private static String id(int notice) {
        return AlertEngine.id("below-zero", SUBJECT, DAY, notice);
    }

    private List<AlertHistory.StoredAlert> notices() {
        return new AlertHistory(first).notices(EnumSet.allOf(Alert.Kind.class)).stream().filter(a -> a.subject().equals(SUBJECT)).toList();
    }

    @Test
    void aQuietPeriodSetThroughOneInstanceHoldsBackTheNextNoticeTheOtherDecides() {
        Instance a = instanceA();
        Instance b = instanceB();

        QuietPeriodBook.QuietPeriod q = a.desk.setQuietPeriod("spread", SUBJECT, T0.plus(Duration.ofHours(4)), "vendor maintenance", "ops-a");
        b.quote(DAY, 500, 480);

        AlertHistory.AlertView opening = new AlertHistory(second).find(id(1));
        assertThat(opening).as("B decided the opening notice of its curve").isNotNull();
        assertThat(opening.stored().quietedBy()).as("held back by the quiet period set through A")
                .startsWith("quiet period " + q.id() + " on spread " + SUBJECT + ", set by ops-a");
        assertThat(opening.deliveries()).as("its delivery skipped").allMatch(d -> d.status().name().equals("SKIPPED"));
        assertThat(b.desk.quietPeriods()).as("B lists the quiet period set through A").extracting(QuietPeriodBook.QuietPeriod::id)
                .containsExactly(q.id());
    }

    @Test
    void aLiftThroughOneInstanceLetsTheOthersNextNoticeOut() {
        Instance a = instanceA();
        QuietPeriodBook.QuietPeriod q = a.desk.setQuietPeriod("spread", SUBJECT, T0.plus(Duration.ofHours(4)), "vendor maintenance", "ops-a");
        Instance b = instanceB(); // started with the quiet period in force
        b.quote(DAY, 500, 480);
        assertThat(new AlertHistory(second).find(id(1)).stored().quietedBy()).as("held back while in force").isNotNull();

        assertThat(a.desk.lift(q.id(), "desk-lead")).isTrue();
        clock.advance(Duration.ofMinutes(61));
        b.tick();

        AlertHistory.AlertView standing = new AlertHistory(second).find(id(2));
        assertThat(standing).as("B's standing notice an hour on").isNotNull();
        assertThat(standing.stored().quietedBy()).as("not held back: lifted through A").isNull();
        assertThat(b.desk.quietPeriods()).singleElement().satisfies(x -> assertThat(x.liftedBy()).isEqualTo("desk-lead"));
    }

    @Test
    void anAcknowledgementThroughOneInstanceStopsTheOthersStandingNotices() {
        Instance a = instanceA();
        Instance b = instanceB();
        b.quote(DAY, 500, 480);
        assertThat(notices()).extracting(n -> n.alert().id()).containsExactly(id(1));

        assertThat(a.desk.acknowledge(id(1), "desk-lead", "seen, watching")).as("A finds B's notice in the journal").isPresent();

        // a quote an hour on: the step decides the standing notice that is due (the path of a live quote)
        clock.advance(Duration.ofMinutes(61));
        b.quote(DAY.plusDays(1), 500, 481);
        assertThat(notices()).extracting(n -> n.alert().id()).as("no standing notice from B's next quote").containsExactly(id(1));
        assertThat(b.desk.openEpisodes().get("below-zero|" + SUBJECT).lastNotice()).as("B holds the episode as acknowledged")
                .isEqualTo(Instant.MAX);
        // and the clock alone an hour later (the path of the tick)
        clock.advance(Duration.ofMinutes(61));
        b.tick();
        assertThat(notices()).extracting(n -> n.alert().id()).as("no standing notice from B's tick either").containsExactly(id(1));

        // the spread back above zero: the closing notice still comes, numbered as if B itself had taken the acknowledgement
        b.quote(DAY.plusDays(2), 500, 510);
        assertThat(notices()).extracting(n -> n.alert().id() + " " + n.alert().kind())
                .containsExactlyInAnyOrder(id(1) + " OPENING", id(2) + " CLOSING");
    }

    @Test
    void anInstanceFollowingTheOthersCurvesAnswersTheirOpenEpisodes() {
        Instance a = instanceA();
        Instance b = instanceB();
        b.quote(DAY, 500, 480); // B opens the episode of its curve

        assertThat(a.desk.openEpisodes()).as("A before following").doesNotContainKey("below-zero|" + SUBJECT);
        assertThat(a.pipeline.follow(c -> c.equals("GOVT-A"))).as("curves A follows that B moved on").containsExactly("GOVT-B");
        assertThat(a.desk.openEpisodes()).as("A's answer for B's curve, after following it")
                .containsKey("below-zero|" + SUBJECT);
        assertThat(a.desk.openEpisodes().get("below-zero|" + SUBJECT).since()).isEqualTo(b.desk.openEpisodes().get("below-zero|" + SUBJECT).since());
    }
}
