package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.BiFunction;
import java.util.function.Function;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.Watch;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.pipeline.Reject;
import org.slopewatch.pipeline.RejectReason;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Severity;
import org.slopewatch.spread.SpreadDefinition;
import org.slopewatch.testsupport.MutableClock;

/**
 * Reading the journal's lists a page at a time, the same checks on H2 ({@link JournalPagesTest})
 * and PostgreSQL ({@link JournalPagesPostgresTest}): a page after a position holds exactly what
 * follows that position in the whole list, so pages read one after another hold every row once.
 * The whole lists come from unpaged reads (the readers the API used before it paged, the export's
 * stream of notices, and for a timeline one such read per kind merged here), so each page is
 * checked against an independent read.
 *
 * <p>The journal is written by the real pipeline with a clock the test sets, so that many rows
 * share one recording time (two steps at {@code T0}; the pages must end inside such groups), and
 * notices share one creation time with ids that sort differently by byte and by a language's
 * collation ({@code B} before {@code a} in ASCII, after it in en_US), so that a page boundary
 * between them depends on the database ordering its own comparisons the way it orders its lists.
 */
abstract class JournalPagesChecks {

    static final Instant T0 = Instant.parse("2026-04-02T10:00:00Z");
    static final String A = "GOVT-A:10Y-3M";
    static final List<Watch> WATCHES = List.of(new Watch(SpreadDefinition.parse("10Y-3M"),
            new MonitorDefinition(0, 0, 1, 0, List.of(new QuarterAverage(0))), Set.of()));
    static final JournalRange ALL = new JournalRange(A, LocalDate.of(1900, 1, 1), LocalDate.of(9999, 12, 31), null);
    static final JournalRange THEN = new JournalRange(A, LocalDate.of(1900, 1, 1), LocalDate.of(9999, 12, 31), T0.plusSeconds(4));

    private final List<AutoCloseable> open = new ArrayList<>();
    private final MutableClock clock = new MutableClock(T0.minus(Duration.ofHours(1)));
    private JournalReader reader;
    private AlertHistory history;
    private AlertViews views;
    private DeliveryAttempts attempts;
    private NewestAlerts newest;
    private TimelineRows timeline;

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
    void writeTheJournal() {
        AgroalDataSource ds = database();
        reader = new JournalReader(ds);
        history = new AlertHistory(ds);
        attempts = new DeliveryAttempts(ds);
        views = new AlertViews(new JournalSql(ds), attempts);
        newest = new NewestAlerts(ds);
        timeline = new TimelineRows(ds);
        QuotePipeline pipeline = new QuotePipeline(WATCHES, new JournalWriter(ds, clock), reader, PipelineListener.NONE, clock);
        pipeline.recover();

        List<LocalDate> days = new ArrayList<>();
        for (LocalDate d = LocalDate.of(2026, 1, 5); days.size() < 20; d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                days.add(d);
            }
        }
        clock.set(T0);
        for (int start = 0; start < 20; start += 10) { // two steps, one recording time
            List<QuoteMessage> quotes = new ArrayList<>();
            for (int i = start; i < start + 10; i++) {
                quotes.add(snapshot("GOVT-A", days.get(i), i % 2 == 0 ? -10 : 10));
                quotes.add(snapshot("GOVT-B", days.get(i), i % 3 == 0 ? -10 : 10));
            }
            pipeline.process(List.of(new QuoteBatch("test", quotes, List.of())));
        }
        clock.set(T0.plusSeconds(1));
        pipeline.process(List.of(new QuoteBatch("test", List.of(snapshot("GOVT-A", days.get(3), -10)), List.of())));
        clock.set(T0.plusSeconds(2));
        List<Reject> rejects = new ArrayList<>();
        for (int i = 0; i < 7; i++) {
            rejects.add(new Reject(RejectReason.MALFORMED, "not valid JSON " + i, i, "{"));
        }
        pipeline.process(List.of(new QuoteBatch("test", List.of(), rejects)));

        // six notices created at one moment, recorded together; two more recorded later but created earlier
        JournalEntries together = new JournalEntries();
        for (String rule : List.of("a", "B", "b", "a-b", "a_b", "Z")) {
            together.alert(entry(rule, days.get(0), T0.plusSeconds(3)));
        }
        clock.set(T0.plusSeconds(3));
        new JournalWriter(ds, clock).write(together);
        JournalEntries later = new JournalEntries();
        later.alert(entry("late", days.get(1), T0));
        later.alert(entry("Late", days.get(1), T0));
        clock.set(T0.plusSeconds(5));
        new JournalWriter(ds, clock).write(later);
        clock.set(T0.plusSeconds(6));
        DeliveryOutbox outbox = new DeliveryOutbox(ds, clock);
        for (DeliveryOutbox.Due due : outbox.due("desk-chat", T0.plusSeconds(6), 100)) {
            outbox.attempt(due.delivery(), T0.plusSeconds(6), "delivered", "HTTP 200", "delivered on attempt 1",
                    DeliveryOutbox.Status.DELIVERED, null);
        }
        clock.set(T0.plusSeconds(7));
        Acknowledgements acks = new Acknowledgements(ds, clock);
        acks.ack("b~" + A + "~" + days.get(0) + "~1", "desk-lead", "one");
        acks.ack("b~" + A + "~" + days.get(0) + "~1", "desk-lead", "two");
        acks.ack("Late~" + A + "~" + days.get(1) + "~1", "ops", null);
    }

    private static QuoteMessage snapshot(String curve, LocalDate date, double spreadBp) {
        return QuoteMessage.of(curve, date, Map.of(Tenor.months(3), 500.0, Tenor.years(10), 500.0 + spreadBp));
    }

    private static JournalEntries.AlertEntry entry(String rule, LocalDate date, Instant created) {
        Alert alert = new Alert(rule + "~" + A + "~" + date + "~1", rule, Severity.INFO, Alert.Kind.OPENING, A, date, "INVERTED",
                "[INFO] GOVT-A 10Y-3M INVERTED", "went below zero\n\n" + Alert.CAUTION, List.of(), "http://localhost:8080/", created);
        return new JournalEntries.AlertEntry(alert, A, date, 1, null, "rules-one", null, List.of(new JournalEntries.Outbox("desk-chat", null)));
    }

    @Test
    void transitionsRejectsAndHistoryPageByPageAreTheWholeList() {
        for (boolean superseded : new boolean[] {true, false}) {
            JournalRange every = new JournalRange(null, ALL.from(), ALL.to(), null);
            List<JournalReader.StoredTransition> whole = reader.transitions(every, superseded, 10_000);
            assertThat(whole).as("enough for pages").hasSizeGreaterThan(20);
            assertThat(JournalPagesChecks.<JournalReader.StoredTransition, JournalReader.TransitionPosition>pages(3,
                    (after, n) -> reader.transitions(every, superseded, after, n),
                    t -> new JournalReader.TransitionPosition(t.date(), t.id()))).as("superseded: %s", superseded).isEqualTo(whole);
        }
        assertThat(reader.transitions(ALL, true, 10_000)).as("some were superseded by the revision")
                .anySatisfy(t -> assertThat(t.supersededBy()).isNotNull());

        List<JournalReader.StoredReject> rejects = reader.rejects(10_000, null);
        assertThat(rejects).hasSize(7);
        assertThat(JournalPagesChecks.<JournalReader.StoredReject, Long>pages(2, (after, n) -> reader.rejects(n, null, after),
                JournalReader.StoredReject::id)).isEqualTo(rejects);

        List<JournalReader.HistoryPoint> history = reader.history(A, ALL.from(), ALL.to(), null);
        assertThat(history).hasSize(20);
        assertThat(reader.history(A, ALL.from(), ALL.to(), null, 6)).as("the first six dates").isEqualTo(history.subList(0, 6));
    }

    @Test
    void noticesNewestFirstPageByPageAreTheWholeList() {
        for (Instant asOf : new Instant[] {null, T0.plusSeconds(4)}) {
            // the export's stream, oldest first (by creation, then id, as the database orders them), read backwards
            List<String> whole = new ArrayList<>(storedIds(exported(new JournalRange(null, ALL.from(), ALL.to(), asOf))));
            Collections.reverse(whole);
            assertThat(whole).hasSize(asOf == null ? 8 : 6);
            for (int n = 1; n <= 3; n++) {
                assertThat(ids(JournalPagesChecks.<AlertHistory.AlertView, NewestAlerts.Position>pages(n, (after, k) -> newest.page(k, asOf, after),
                        v -> new NewestAlerts.Position(v.stored().alert().createdAt(), v.stored().alert().id()))))
                        .as("%d a page, as of %s", n, asOf).isEqualTo(whole);
            }
        }
    }

    @Test
    void aTimelinePageAfterAnyRowHoldsWhatFollowsItInTheWholeTimeline() {
        for (JournalRange range : List.of(ALL, THEN)) {
            List<TimelineRows.Row<?>> whole = whole(range);
            if (range.asOf() == null) {
                assertThat(whole).as("rows of every kind").extracting(r -> r.position().kind()).contains(TimelineRows.Kind.values());
            }
            // after each row (and from the start), each kind's next rows are the ones after it in the whole timeline
            for (int i = -1; i < whole.size(); i++) {
                TimelineRows.Position after = i < 0 ? null : whole.get(i).position();
                List<TimelineRows.Row<?>> rest = whole.subList(i + 1, whole.size());
                for (TimelineRows.Kind kind : TimelineRows.Kind.values()) {
                    List<Object> expected = rest.stream().filter(r -> r.position().kind() == kind).limit(4).map(TimelineRows.Row::value)
                            .map(Object.class::cast).toList();
                    assertThat(read(kind, range, after, 4)).as("%s after row %d of %s", kind, i, range.asOf()).isEqualTo(expected);
                }
            }
        }
    }

    /**
     * The whole timeline merged here from unpaged reads of each kind: by recording time, then kind,
     * then each kind's own order. Observations and transitions come from the readers the API used
     * before paging ({@link JournalReader#observations}, {@link JournalReader#transitions}), notices
     * from the export's stream ({@link AlertHistory#eachAlert}, by creation: a stable sort by
     * recording time here keeps the database's order within one recording) completed by the same
     * views as the API's, attempts from {@link DeliveryAttempts#attempts(List, Instant)}.
     */
    private List<TimelineRows.Row<?>> whole(JournalRange range) {
        List<TimelineRows.Row<?>> rows = new ArrayList<>();
        reader.observations(range, 10_000).stream().sorted(Comparator.comparing(JournalReader.StoredObservation::recordedAt)
                        .thenComparingLong(JournalReader.StoredObservation::id))
                .forEach(o -> rows.add(new TimelineRows.Row<>(o, TimelineRows.Position.of(o.recordedAt(), TimelineRows.Kind.OBSERVATION, o.id()))));
        reader.transitions(range, true, 10_000).stream().sorted(Comparator.comparing(JournalReader.StoredTransition::recordedAt)
                        .thenComparingLong(JournalReader.StoredTransition::id))
                .forEach(t -> rows.add(new TimelineRows.Row<>(t, TimelineRows.Position.of(t.recordedAt(), TimelineRows.Kind.TRANSITION, t.id()))));
        Map<String, AlertHistory.StoredAlert> stored = new LinkedHashMap<>();
        exported(range).stream().sorted(Comparator.comparing(AlertHistory.StoredAlert::recordedAt))
                .forEach(a -> stored.put(a.alert().id(), a));
        List<AlertHistory.AlertView> alerts = views.of(stored, range.asOf());
        alerts.forEach(v -> rows.add(new TimelineRows.Row<>(v, TimelineRows.Position.ofAlert(v.stored().recordedAt(),
                v.stored().alert().createdAt(), v.stored().alert().id()))));
        attempts.attempts(ids(alerts), range.asOf()).stream().sorted(Comparator.comparing(DeliveryAttempts.StoredAttempt::recordedAt)
                        .thenComparingLong(DeliveryAttempts.StoredAttempt::id))
                .forEach(a -> rows.add(new TimelineRows.Row<>(a, TimelineRows.Position.of(a.recordedAt(), TimelineRows.Kind.ATTEMPT, a.id()))));
        // acknowledgements carry no id outside the journal: they are taken from the timeline's own read, checked against the views'
        List<TimelineRows.Row<AlertHistory.Ack>> acks = timeline.acks(range, null, 10_000);
        assertThat(acks.stream().map(TimelineRows.Row::value).toList()).as("the acknowledgements the alert views hold")
                .containsExactlyInAnyOrderElementsOf(alerts.stream().flatMap(v -> v.acks().stream()).toList());
        rows.addAll(acks);
        rows.sort(Comparator.<TimelineRows.Row<?>, Instant>comparing(r -> r.position().recordedAt()).thenComparing(r -> r.position().kind()));
        return rows;
    }

    private List<Object> read(TimelineRows.Kind kind, JournalRange range, TimelineRows.Position after, int limit) {
        List<? extends TimelineRows.Row<?>> rows = switch (kind) {
            case OBSERVATION -> timeline.observations(range, after, limit);
            case TRANSITION -> timeline.transitions(range, after, limit);
            case ALERT -> timeline.alerts(range, after, limit);
            case ATTEMPT -> timeline.attempts(range, after, limit);
            case ACK -> timeline.acks(range, after, limit);
        };
        return rows.stream().map(TimelineRows.Row::value).map(Object.class::cast).toList();
    }

    /** Reads a list page after page, each page {@code n} long, until a page comes back short. */
    private static <T, P> List<T> pages(int n, BiFunction<P, Integer, List<T>> page, Function<T, P> position) {
        List<T> all = new ArrayList<>();
        P after = null;
        while (true) {
            List<T> rows = page.apply(after, n);
            all.addAll(rows);
            assertThat(all).as("pages end").hasSizeLessThan(10_000);
            if (rows.size() < n) {
                return all;
            }
            after = position.apply(rows.get(rows.size() - 1));
        }
    }

    private static List<String> ids(List<AlertHistory.AlertView> views) {
        return views.stream().map(v -> v.stored().alert().id()).toList();
    }

    private static List<String> storedIds(List<AlertHistory.StoredAlert> alerts) {
        return alerts.stream().map(a -> a.alert().id()).toList();
    }

    /** Every notice of a range as the export streams it: by creation, then id. */
    private List<AlertHistory.StoredAlert> exported(JournalRange range) {
        List<AlertHistory.StoredAlert> out = new ArrayList<>();
        try {
            history.eachAlert(range, out::add);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // a list never throws it
        }
        return out;
    }
}
