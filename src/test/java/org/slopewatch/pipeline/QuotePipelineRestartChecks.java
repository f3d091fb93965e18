package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.agroal.api.AgroalDataSource;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.curve.Tenor;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.Watch;
import org.slopewatch.spread.SpreadDefinition;

/**
 * A stop and restart at any point gives the same states, spells and transitions as an
 * uninterrupted run: the pipeline rebuilds itself from the journal. The checks are written once
 * here and run against each journal database by a subclass: {@link QuotePipelineRestartTest}
 * (H2, the embedded default) and {@link QuotePipelineRestartPostgresTest} (a real PostgreSQL).
 */
abstract class QuotePipelineRestartChecks {

    private final List<AutoCloseable> open = new ArrayList<>();
    private final Clock clock = Clock.fixed(Instant.parse("2030-01-01T00:00:00Z"), ZoneOffset.UTC);
    private static final List<Watch> WATCHES = List.of(
            new Watch(SpreadDefinition.parse("10Y-3M"), new MonitorDefinition(0, 5, 2, 60,
                    List.of(new QuarterAverage(0), new DaysInverted(45))), Set.of()),
            new Watch(SpreadDefinition.parse("10Y-2Y"), new MonitorDefinition(0, 0, 1, 30, List.of(new DaysInverted(20))), Set.of()));

    /**
     * A new, empty journal, migrated and kept apart from every other one; {@code name} tells the
     * journals of one test apart. Register what must be closed with {@link #closeAfterTest}.
     */
    protected abstract AgroalDataSource database(String name);

    /** Closes {@code resource} after the test, before anything registered earlier. */
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

    private QuotePipeline pipeline(AgroalDataSource ds) {
        QuotePipeline p = new QuotePipeline(WATCHES, new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE, clock);
        p.recover();
        return p;
    }

    /** A year of business days on two curves through an inversion, with revisions, replacements and duplicates. */
    static List<QuoteBatch> scenario(long seed) {
        Random random = new Random(seed);
        List<QuoteBatch> batches = new ArrayList<>();
        LocalDate date = LocalDate.of(2026, 1, 1);
        double shortRate = 300;
        int n = 0;
        for (int day = 0; day < 260; day++) {
            date = date.plusDays(date.getDayOfWeek().getValue() >= 5 ? 8 - date.getDayOfWeek().getValue() : 1);
            shortRate += day < 120 ? 2.0 : -2.5;
            for (String curve : List.of("GOVT-A", "GOVT-B")) {
                double tilt = curve.equals("GOVT-A") ? 0 : 150;
                List<QuoteMessage> messages = new ArrayList<>();
                messages.add(new QuoteMessage("m" + (n++), "test", null, curve, date, new java.util.TreeMap<>(Map.of(
                        Tenor.months(3), shortRate + random.nextGaussian() * 3,
                        Tenor.years(2), 380 + tilt + random.nextGaussian() * 3))));
                messages.add(new QuoteMessage("m" + (n++), "test", null, curve, date, new java.util.TreeMap<>(Map.of(
                        Tenor.years(10), 420 + tilt + random.nextGaussian() * 3))));
                if (day % 17 == 5) {
                    // a corrected 10Y for the same date replaces the provisional value
                    messages.add(new QuoteMessage("m" + (n++), "test", null, curve, date, new java.util.TreeMap<>(Map.of(
                            Tenor.years(10), 420 + tilt - 25))));
                }
                if (day % 29 == 11) {
                    // a revision of a date a week back
                    messages.add(new QuoteMessage("m" + (n++), "test", null, curve, date.minusDays(7), new java.util.TreeMap<>(Map.of(
                            Tenor.months(3), shortRate + 60))));
                }
                if (day % 13 == 3) {
                    messages.add(messages.get(0)); // a duplicate id
                }
                batches.add(new QuoteBatch("test", messages, List.of()));
            }
        }
        // the week-back revisions above deepen values without changing an outcome; this one must: a 10Y of
        // 100 bp on the first day inverts both of GOVT-A's spreads that day, so every transition since is superseded
        batches.add(new QuoteBatch("test", List.of(new QuoteMessage("m" + n, "test", null, "GOVT-A", LocalDate.of(2026, 1, 2),
                new java.util.TreeMap<>(Map.of(Tenor.years(10), 100.0)))), List.of()));
        return batches;
    }

    @Test
    void aRestartAtAnyPointGivesTheSameOutcomeAsAnUninterruptedRun() {
        List<QuoteBatch> batches = scenario(7);

        AgroalDataSource straight = database("straight");
        QuotePipeline uninterrupted = pipeline(straight);
        batches.forEach(b -> uninterrupted.process(List.of(b)));

        for (int stopAt : new int[] {1, 97, 250, 401}) {
            AgroalDataSource ds = database("restart-" + stopAt);
            QuotePipeline first = pipeline(ds);
            batches.subList(0, stopAt).forEach(b -> first.process(List.of(b)));
            QuotePipeline second = pipeline(ds); // the first is gone: rebuilt from the journal alone
            batches.subList(stopAt, batches.size()).forEach(b -> second.process(List.of(b)));

            assertThat(second.spreads()).as("states and open spells after a restart at batch %d", stopAt)
                    .isEqualTo(uninterrupted.spreads());
            JournalReader expected = new JournalReader(straight);
            JournalReader actual = new JournalReader(ds);
            assertThat(outcomes(actual)).as("journalled transitions after a restart at batch %d", stopAt)
                    .isEqualTo(outcomes(expected));
        }
        assertThat(outcomes(new JournalReader(straight))).as("the scenario does exercise the monitor and revisions")
                .anyMatch(s -> s.contains("CONFIRMED")).anyMatch(s -> s.contains("superseded"));
    }

    /**
     * A backfill feeds thousands of messages per step; the journal must end as it does when the
     * daemon takes the same messages one request at a time: the same quotes in the same order, the
     * same observations, transitions (revisions included) and spells, and a daemon started on it
     * recovers the same states. The reference is the pipeline driven one batch per step, as
     * {@code QuoteResource} drives it for each request.
     */
    @Test
    void aBackfillInLargeStepsJournalsWhatOneStepPerRequestJournals() {
        List<QuoteBatch> batches = scenario(11);
        AgroalDataSource oneByOne = database("one-by-one");
        QuotePipeline daemon = pipeline(oneByOne);
        batches.forEach(b -> daemon.process(List.of(b)));

        List<QuoteMessage> messages = batches.stream().flatMap(b -> b.messages().stream()).toList();
        AgroalDataSource backfilled = database("backfilled");
        long[] fed = {0};
        HistoryBackfill.Totals totals = new HistoryBackfill(pipeline(backfilled), "test", 300).feed(messages, n -> fed[0] = n);

        assertThat(totals.steps()).as("steps of 300 for %d messages", messages.size()).isEqualTo((messages.size() + 299) / 300);
        assertThat(fed[0]).isEqualTo(messages.size());
        assertThat(totals.duplicates()).as("the scenario's repeated ids").isPositive();
        assertThat(journalRows(backfilled, "SELECT seq, message_id, origin, curve, market_date, yields FROM quote ORDER BY seq"))
                .as("quotes").isNotEmpty().isEqualTo(journalRows(oneByOne, "SELECT seq, message_id, origin, curve, market_date, yields FROM quote ORDER BY seq"));
        String observations = "SELECT seq, spread_id, market_date, value_bp FROM observation ORDER BY seq, spread_id, market_date, value_bp";
        assertThat(journalRows(backfilled, observations)).as("observations").isEqualTo(journalRows(oneByOne, observations));
        org.slopewatch.testsupport.JournalContents expected = org.slopewatch.testsupport.JournalContents.read(oneByOne);
        org.slopewatch.testsupport.JournalContents actual = org.slopewatch.testsupport.JournalContents.read(backfilled);
        // the last column says whether a revision superseded the row: both values, so revisions were exercised
        assertThat(actual.transitions().stream().map(t -> t.substring(t.lastIndexOf('|'))).distinct()).as("superseded and standing")
                .hasSize(2);
        assertThat(actual.transitions()).as("transitions").isEqualTo(expected.transitions());
        assertThat(actual.spells()).as("spells").isNotEmpty().isEqualTo(expected.spells());
        assertThat(actual.quotes()).isEqualTo(expected.quotes());
        assertThat(pipeline(backfilled).spreads()).as("states a daemon recovers from the backfilled journal")
                .isEqualTo(daemon.spreads());
    }

    /** A pipeline holding {@code days} of history in memory and keeping checkpoints in the journal, rebuilt from it. */
    private QuotePipeline checkpointed(AgroalDataSource ds, List<Watch> watches, int days) {
        QuotePipeline p = new QuotePipeline(watches, new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE,
                AlertStage.NONE, clock, new QuotePipeline.Memory(1_000, days, new CurveCheckpoints(ds, clock)));
        p.recover();
        return p;
    }

    /**
     * The scenario with revisions of dates far back (up to ten months): with two months held in
     * memory these are re-run from the journal, the rest from what memory holds.
     */
    static List<QuoteBatch> scenarioWithOldRevisions(long seed) {
        List<QuoteBatch> batches = new ArrayList<>(scenario(seed));
        Random random = new Random(seed * 31);
        int n = 0;
        for (int at = 120; at < batches.size(); at += 40 + random.nextInt(60)) {
            QuoteMessage latest = batches.get(at - 1).messages().get(0);
            LocalDate back = latest.date().minusDays(60 + random.nextInt(240));
            double tenYear = random.nextBoolean() ? 100.0 : 420 + random.nextGaussian() * 5;
            batches.add(at, new QuoteBatch("test", List.of(new QuoteMessage("old-" + seed + "-" + (n++), "test", null, latest.curve(), back,
                    new java.util.TreeMap<>(Map.of(Tenor.years(10), tenYear)))), List.of()));
        }
        return batches;
    }

    /**
     * A checkpoint is a cache: states after checkpoints and the quotes after them equal the states
     * after a full replay of the journal, and the journal a run with checkpoints, restarts and
     * bounded memory writes equals the journal of an uninterrupted run holding every value (the
     * reference: the pipeline as it ran before either existed). Random histories with revisions old
     * and new, checkpoints and restarts at random points.
     */
    @Test
    void checkpointsAndTheQuotesAfterThemGiveWhatAFullReplayGives() {
        for (long seed : new long[] {3, 8, 21}) {
            List<QuoteBatch> batches = scenarioWithOldRevisions(seed);
            AgroalDataSource straight = database("whole-" + seed);
            QuotePipeline uninterrupted = pipeline(straight);
            batches.forEach(b -> uninterrupted.process(List.of(b)));

            AgroalDataSource ds = database("checkpointed-" + seed);
            Random random = new Random(seed);
            QuotePipeline p = checkpointed(ds, WATCHES, QuotePipeline.Memory.MIN_DAYS);
            int restarts = 0;
            for (int i = 0; i < batches.size(); i++) {
                p.process(List.of(batches.get(i)));
                if (random.nextInt(25) == 0) {
                    p.checkpoint(CurveOwnership.ALL);
                }
                if (random.nextInt(60) == 0) {
                    p = checkpointed(ds, WATCHES, QuotePipeline.Memory.MIN_DAYS);
                    restarts++;
                    assertThat(p.spreads()).as("seed %d: states from checkpoints and tail after batch %d", seed, i)
                            .isEqualTo(pipeline(ds).spreads());
                }
                assertThat(p.mostHeld()).as("seed %d: values held in memory after batch %d", seed, i)
                        .isLessThanOrEqualTo(QuotePipeline.Memory.MIN_DAYS + 64 + 3 * 64);
                if (i % 20 == 0) {
                    // not only at the end, where the last revision rewrites every spell of GOVT-A: a late value that
                    // changed a spell's figures and no transition wrote them over in its own step
                    assertThat(spellRows(ds)).as("seed %d: spells and their figures after batch %d", seed, i)
                            .isEqualTo(spellsOfStandingValues(ds));
                }
            }
            assertThat(restarts).as("seed %d: restarts", seed).isGreaterThan(3);
            assertThat(p.spreads()).as("seed %d: states at the end", seed).isEqualTo(uninterrupted.spreads());
            org.slopewatch.testsupport.JournalContents expected = org.slopewatch.testsupport.JournalContents.read(straight);
            org.slopewatch.testsupport.JournalContents actual = org.slopewatch.testsupport.JournalContents.read(ds);
            assertThat(actual.transitions()).as("seed %d: transitions, superseded ones included", seed).isEqualTo(expected.transitions());
            assertThat(actual.spells()).as("seed %d: spells", seed).isEqualTo(expected.spells());
            // both runs write a revision's spells by one rule, so the journal is also checked against itself:
            // a row for each spell that a standing transition ended, none for any other (a revision rewrites
            // only the spells that can have changed and must leave the rows of the others)
            for (AgroalDataSource journal : List.of(ds, straight)) {
                assertThat(journalRows(journal, "SELECT spread_id, spell_id, end_date FROM spell ORDER BY spread_id, spell_id"))
                        .as("seed %d: the spells the standing transitions ended", seed).isNotEmpty()
                        .isEqualTo(journalRows(journal, "SELECT spread_id, spell_id, market_date FROM transition "
                                + "WHERE superseded_by IS NULL AND test = 'exit' ORDER BY spread_id, spell_id"));
            }
            // and their figures are those of the standing values: a late value that changed a spell's figures
            // and no transition wrote them over at once, in both runs
            for (AgroalDataSource journal : List.of(ds, straight)) {
                assertThat(spellRows(journal)).as("seed %d: spells and their figures", seed).isEqualTo(spellsOfStandingValues(journal));
            }
            // the last column says whether a revision superseded the row: both values, so revisions were exercised
            assertThat(actual.transitions().stream().map(t -> t.substring(t.lastIndexOf('|'))).distinct())
                    .as("seed %d: superseded and standing transitions", seed).hasSize(2);
            // memory let go of the older transitions and spells too: the journal answers for them
            p.checkpoint(CurveOwnership.ALL);
            SignalEngine held = heldInCheckpoints(ds);
            int transitionsHeld = held.tracks().stream().mapToInt(t -> t.transitions().size()).sum();
            int spellsHeld = held.tracks().stream().mapToInt(t -> t.endedSpells().size()).sum();
            assertThat(transitionsHeld).as("seed %d: transitions held in memory", seed)
                    .isLessThan(journalRows(ds, "SELECT id FROM transition WHERE superseded_by IS NULL").size());
            assertThat(spellsHeld).as("seed %d: spells held in memory", seed).isLessThan(actual.spells().size());
        }
    }

    /** The tracks as the checkpoints hold them: what memory held when they were written. */
    private SignalEngine heldInCheckpoints(AgroalDataSource ds) {
        SignalEngine engine = new SignalEngine(WATCHES);
        CurveImages images = new CurveImages(WATCHES);
        new CurveCheckpoints(ds, clock).each(null, stored -> {
            try {
                images.read(stored, new CurveBook(), engine);
            } catch (java.io.IOException e) {
                throw new AssertionError("checkpoint of " + stored.curve() + " not read", e);
            }
        });
        return engine;
    }

    @Test
    void aStartAfterACheckpointReplaysOnlyTheQuotesAfterIt() {
        List<QuoteBatch> batches = scenario(5);
        AgroalDataSource ds = database("tail");
        QuotePipeline first = checkpointed(ds, WATCHES, 120);
        batches.subList(0, 300).forEach(b -> first.process(List.of(b)));
        assertThat(first.checkpoint(CurveOwnership.ALL)).as("curves checkpointed").isEqualTo(2);
        assertThat(first.checkpoint(CurveOwnership.ALL)).as("nothing changed since").isZero();
        batches.subList(300, 310).forEach(b -> first.process(List.of(b)));
        long after = new JournalReader(ds).quoteCount();

        QuotePipeline second = new QuotePipeline(WATCHES, new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE,
                AlertStage.NONE, clock, new QuotePipeline.Memory(1_000, 120, new CurveCheckpoints(ds, clock)));
        long replayed = second.recover();

        long tail = batches.subList(300, 310).stream().mapToLong(b -> b.messages().stream().map(QuoteMessage::id).distinct().count()).sum();
        assertThat(replayed).as("quotes replayed of %d journalled", after).isEqualTo(tail);
        assertThat(second.spreads()).isEqualTo(pipeline(ds).spreads());
        assertThat(first.checkpoint(c -> false)).as("curves another instance owns are not checkpointed").isZero();
    }

    @Test
    void aDamagedCheckpointOrOneOfAnotherLayoutOrPolicyIsPassedOver() throws Exception {
        List<QuoteBatch> batches = scenario(9);
        AgroalDataSource ds = database("damaged");
        QuotePipeline first = checkpointed(ds, WATCHES, 90);
        batches.forEach(b -> first.process(List.of(b)));
        first.checkpoint(CurveOwnership.ALL);
        List<org.slopewatch.monitor.SpreadStatus> expected = pipeline(ds).spreads();

        try (java.sql.Connection c = ds.getConnection()) {
            byte[] image;
            try (java.sql.PreparedStatement s = c.prepareStatement("SELECT image FROM curve_checkpoint WHERE curve = 'GOVT-A'");
                 java.sql.ResultSet rs = s.executeQuery()) {
                rs.next();
                image = rs.getBytes(1);
            }
            image[image.length / 2] ^= 0x10; // one bit flipped in the middle
            try (java.sql.PreparedStatement s = c.prepareStatement("UPDATE curve_checkpoint SET image = ? WHERE curve = 'GOVT-A'")) {
                s.setBytes(1, image);
                s.executeUpdate();
            }
        }
        QuotePipeline damaged = checkpointed(ds, WATCHES, 90);
        assertThat(damaged.spreads()).as("states with GOVT-A's checkpoint damaged").isEqualTo(expected);

        damaged.checkpoint(CurveOwnership.ALL); // GOVT-A, rebuilt from its quotes, is written again
        try (java.sql.Connection c = ds.getConnection(); java.sql.Statement s = c.createStatement()) {
            s.executeUpdate("UPDATE curve_checkpoint SET layout = 0 WHERE curve = 'GOVT-B'");
        }
        assertThat(checkpointed(ds, WATCHES, 90).spreads()).as("states with GOVT-B's checkpoint in an old layout").isEqualTo(expected);

        // another policy: the same spreads under other rules; its checkpoints would carry the old rules' states
        List<Watch> other = List.of(
                new Watch(SpreadDefinition.parse("10Y-3M"), new MonitorDefinition(-10, 0, 1, 30, List.of(new DaysInverted(10))), Set.of()),
                WATCHES.get(1));
        QuotePipeline reference = new QuotePipeline(other, new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE, clock);
        reference.recover();
        assertThat(checkpointed(ds, other, 90).spreads()).as("states under another policy").isEqualTo(reference.spreads())
                .isNotEqualTo(expected);
    }

    /**
     * Two instances on one journal, each processing its own curve; when one stops, the other takes
     * its curve over and rebuilds that curve alone (from its checkpoint and the quotes after it),
     * and the end is what one instance taking every quote comes to. An assignment right after a
     * start rebuilds nothing: memory is current.
     */
    @Test
    void aTakeoverRebuildsOnlyTheCurvesAnotherInstanceMovedOn() {
        List<QuoteBatch> batches = scenarioWithOldRevisions(4);
        AgroalDataSource alone = database("one-instance");
        QuotePipeline single = pipeline(alone);
        batches.forEach(b -> single.process(List.of(b)));

        AgroalDataSource shared = database("two-instances");
        QuotePipeline a = checkpointed(shared, WATCHES, 90);
        QuotePipeline b = checkpointed(shared, WATCHES, 90);
        CurveOwnership aOwns = curve -> curve.equals("GOVT-A");
        CurveOwnership bOwns = curve -> !aOwns.owns(curve);
        assertThat(a.takeOver(aOwns)).as("first assignment after a start").isEmpty();
        assertThat(b.takeOver(bOwns)).as("first assignment after a start").isEmpty();
        int stopAt = batches.size() * 3 / 5;
        for (int i = 0; i < stopAt; i++) {
            QuoteBatch batch = batches.get(i);
            (aOwns.owns(batch.messages().get(0).curve()) ? a : b).process(List.of(batch));
            if (i % 50 == 0) {
                a.checkpoint(aOwns);
                b.checkpoint(bOwns);
            }
            if (i == stopAt / 2) {
                // reads from either instance: the one not owning GOVT-A follows it from the journal
                assertThat(b.follow(bOwns)).as("curves the other instance moved on").containsExactly("GOVT-A");
                assertThat(b.follow(bOwns)).as("followed again with nothing moved on").isEmpty();
                assertThat(b.spreads().stream().filter(x -> x.curve().equals("GOVT-A")))
                        .as("GOVT-A as the instance not owning it answers").isNotEmpty()
                        .containsExactlyElementsOf(a.spreads().stream().filter(x -> x.curve().equals("GOVT-A")).toList());
            }
        }
        a.checkpoint(aOwns); // as its shutdown does

        assertThat(b.takeOver(CurveOwnership.ALL)).as("curves rebuilt by the survivor").containsExactly("GOVT-A");
        assertThat(b.takeOver(CurveOwnership.ALL)).as("a second assignment with nothing moved on").isEmpty();
        batches.subList(stopAt, batches.size()).forEach(x -> b.process(List.of(x)));

        // in any order: two instances number their steps each on their own, so which curve came first is theirs to say
        assertThat(b.spreads()).as("states after the takeover and the rest of the quotes")
                .containsExactlyInAnyOrderElementsOf(single.spreads());
        org.slopewatch.testsupport.JournalContents expected = org.slopewatch.testsupport.JournalContents.read(alone);
        org.slopewatch.testsupport.JournalContents actual = org.slopewatch.testsupport.JournalContents.read(shared);
        assertThat(actual.transitions()).as("transitions").isEqualTo(expected.transitions());
        assertThat(actual.spells()).as("spells").isEqualTo(expected.spells());

        b.checkpoint(CurveOwnership.ALL); // the survivor holds both curves now
        assertThat(checkpointed(shared, WATCHES, 90).takeOver(CurveOwnership.ALL))
                .as("an instance started from the checkpoints, then assigned every curve: memory is current").isEmpty();
    }

    /** The journal's spell rows, every figure, in one text per row. */
    private static List<String> spellRows(AgroalDataSource ds) {
        List<String> out = new ArrayList<>();
        try (java.sql.Connection c = ds.getConnection(); java.sql.Statement s = c.createStatement();
             java.sql.ResultSet rs = s.executeQuery("SELECT spread_id, spell_id, start_date, confirmed_date, confirmed_by, end_date, "
                     + "duration_days, observations, deepest_bp, deepest_date, area_bp_days FROM spell ORDER BY spread_id, spell_id")) {
            while (rs.next()) {
                out.add(spellText(rs.getString(1), rs.getLong(2), rs.getObject(3, LocalDate.class), rs.getObject(4, LocalDate.class),
                        rs.getString(5), rs.getObject(6, LocalDate.class), rs.getLong(7), rs.getInt(8), rs.getDouble(9),
                        rs.getObject(10, LocalDate.class), rs.getDouble(11)));
            }
        } catch (java.sql.SQLException e) {
            throw new AssertionError(e);
        }
        return out;
    }

    /**
     * The reference for {@link #spellRows}: the spells a fresh monitor concludes from each spread's
     * standing values (a date's latest row) in date order, without any revision, as texts alike.
     */
    private static List<String> spellsOfStandingValues(AgroalDataSource ds) {
        Map<String, java.util.TreeMap<LocalDate, org.slopewatch.monitor.Observation>> standing = new java.util.TreeMap<>();
        for (String row : journalRows(ds, "SELECT spread_id, market_date, value_bp, seq FROM observation ORDER BY seq")) {
            String[] f = row.split(" \\| ");
            LocalDate date = LocalDate.parse(f[1]);
            standing.computeIfAbsent(f[0], k -> new java.util.TreeMap<>())
                    .put(date, new org.slopewatch.monitor.Observation(date, Double.parseDouble(f[2]), Long.parseLong(f[3])));
        }
        List<String> out = new ArrayList<>();
        standing.forEach((id, values) -> {
            org.slopewatch.spread.SpreadKey key = org.slopewatch.spread.SpreadKey.parse(id);
            Watch watch = WATCHES.stream().filter(w -> w.spread().name().equals(key.spread())).findFirst().orElseThrow();
            org.slopewatch.monitor.SpreadTrack track = new org.slopewatch.monitor.SpreadTrack(
                    new org.slopewatch.monitor.InversionMonitor(watch.rules()), key);
            values.values().forEach(track::record);
            for (org.slopewatch.monitor.Spell sp : track.endedSpells()) {
                out.add(spellText(id, sp.id(), sp.start(), sp.confirmed(), sp.confirmedBy(), sp.end(), sp.durationDays(),
                        sp.observations(), sp.deepestBp(), sp.deepestDate(), sp.invertedAreaBpDays()));
            }
        });
        return out;
    }

    private static String spellText(String spread, long id, LocalDate start, LocalDate confirmed, String confirmedBy, LocalDate end,
                                    long days, int observations, double deepest, LocalDate deepestDate, double area) {
        return String.join(" | ", spread, Long.toString(id), String.valueOf(start), String.valueOf(confirmed), String.valueOf(confirmedBy),
                String.valueOf(end), Long.toString(days), Integer.toString(observations), Double.toString(deepest),
                String.valueOf(deepestDate), Double.toString(area));
    }

    private static List<String> journalRows(AgroalDataSource ds, String query) {
        List<String> out = new ArrayList<>();
        try (java.sql.Connection c = ds.getConnection(); java.sql.Statement s = c.createStatement();
             java.sql.ResultSet rs = s.executeQuery(query)) {
            int columns = rs.getMetaData().getColumnCount();
            while (rs.next()) {
                StringBuilder row = new StringBuilder();
                for (int i = 1; i <= columns; i++) {
                    row.append(i == 1 ? "" : " | ").append(rs.getString(i));
                }
                out.add(row.toString());
            }
        } catch (java.sql.SQLException e) {
            throw new AssertionError(e);
        }
        return out;
    }

    @Test
    void duplicatesAreIgnoredAndCountedEvenAcrossARestart() {
        AgroalDataSource ds = database("dups");
        QuoteMessage m = new QuoteMessage("abc-1", "test", null, "GOVT-A", LocalDate.of(2026, 3, 2),
                new java.util.TreeMap<>(Map.of(Tenor.years(10), 400.0, Tenor.months(3), 410.0)));
        BatchOutcome first = pipeline(ds).process(List.of(new QuoteBatch("test", List.of(m, m), List.of())));
        assertThat(first.accepted()).isEqualTo(1);
        assertThat(first.duplicates()).isEqualTo(1);
        BatchOutcome afterRestart = pipeline(ds).process(List.of(new QuoteBatch("test", List.of(m), List.of())));
        assertThat(afterRestart.accepted()).isZero();
        assertThat(afterRestart.duplicates()).isEqualTo(1);
    }

    /** A pipeline that keeps at most {@code cache} message ids in memory, rebuilt from the journal. */
    private QuotePipeline pipeline(AgroalDataSource ds, int cache) {
        QuotePipeline p = new QuotePipeline(WATCHES, new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE,
                AlertStage.NONE, clock, cache);
        p.recover();
        return p;
    }

    private static QuoteBatch one(QuoteMessage m) {
        return new QuoteBatch("test", List.of(m), List.of());
    }

    /**
     * Memory keeps only the most recent ids; the journal answers for older ones, so a message sent
     * again long after is still a duplicate, in the same run and after a restart (which loads no ids).
     */
    @Test
    void aDuplicateOfAMessageMemoryHasLetGoIsStillRecognised() {
        AgroalDataSource ds = database("evicted");
        QuotePipeline p = pipeline(ds, 3);
        List<QuoteMessage> sent = new ArrayList<>();
        for (int i = 0; i < 20; i++) {
            sent.add(new QuoteMessage("early-" + i, "test", null, "GOVT-A", LocalDate.of(2026, 3, 2).plusDays(i),
                    new java.util.TreeMap<>(Map.of(Tenor.years(10), 400.0 + i, Tenor.months(3), 410.0))));
        }
        sent.forEach(m -> p.process(List.of(one(m))));
        assertThat(p.seenIdsInMemory()).as("ids in memory after 20 messages with room for 3").isEqualTo(3);

        BatchOutcome again = p.process(List.of(one(sent.get(0))));
        assertThat(again.duplicates()).as("the first message, long gone from memory, sent again").isEqualTo(1);
        assertThat(again.accepted()).isZero();

        QuotePipeline restarted = pipeline(ds, 3);
        assertThat(restarted.seenIdsInMemory()).as("ids loaded by a restart").isZero();
        QuoteMessage fresh = new QuoteMessage("later-0", "test", null, "GOVT-A", LocalDate.of(2026, 4, 1),
                new java.util.TreeMap<>(Map.of(Tenor.years(10), 380.0, Tenor.months(3), 410.0)));
        BatchOutcome afterRestart = restarted.process(List.of(new QuoteBatch("test", List.of(sent.get(1), fresh, fresh), List.of())));
        assertThat(afterRestart.duplicates()).as("an old message and a second copy of a new one in the same step").isEqualTo(2);
        assertThat(afterRestart.accepted()).isEqualTo(1);
        assertThat(new JournalReader(ds).quoteCount()).as("quote messages journalled").isEqualTo(21);
    }

    /**
     * However many messages pass, memory holds at most the configured number of ids, and the
     * duplicates found are exactly those an unbounded set of every id ever seen finds (the JDK's
     * {@code HashSet}, the reference).
     */
    @Test
    void memoryForSeenIdsStaysBoundedAndDeDuplicationExact() {
        List<QuoteBatch> batches = scenario(7);
        AgroalDataSource ds = database("bounded");
        QuotePipeline p = pipeline(ds, 50);
        Set<String> everySeen = new java.util.HashSet<>();
        int expectedDuplicates = 0;
        int duplicates = 0;
        int messages = 0;
        for (int i = 0; i < batches.size(); i++) {
            for (QuoteMessage m : batches.get(i).messages()) {
                messages++;
                if (!everySeen.add(m.id())) {
                    expectedDuplicates++;
                }
            }
            duplicates += p.process(List.of(batches.get(i))).duplicates();
            assertThat(p.seenIdsInMemory()).as("ids in memory after batch %d", i).isLessThanOrEqualTo(50);
            if (i == 200) {
                p = pipeline(ds, 50); // a restart half way: the journal alone answers for what came before
            }
        }
        // the first hundred batches sent again: every first copy came hundreds of ids ago, long gone from memory
        List<QuoteBatch> again = batches.subList(0, 100);
        for (QuoteBatch b : again) {
            expectedDuplicates += b.messages().size();
            duplicates += p.process(List.of(b)).duplicates();
        }
        assertThat(messages).as("messages far beyond the bound").isGreaterThan(20 * 50);
        assertThat(p.seenIdsInMemory()).isEqualTo(50);
        assertThat(duplicates).as("duplicates found, against an unbounded set of every id").isEqualTo(expectedDuplicates)
                .isGreaterThan(100);
        assertThat(new JournalReader(ds).quoteCount()).as("every distinct message journalled once").isEqualTo(everySeen.size());
    }

    /**
     * A step that fails before its transaction commits, here while deciding its alerts, took
     * nothing: the same message sent again is accepted and journalled, not dropped as a duplicate
     * of one the journal never got.
     */
    @Test
    void aStepThatFailsBeforeItsCommitTakesNoIdAsSeen() {
        AgroalDataSource ds = database("failed-step");
        boolean[] failNext = {true};
        AlertStage failingOnce = failingWhen(() -> {
            boolean fail = failNext[0];
            failNext[0] = false;
            return fail;
        }, "the alert stage failed");
        QuotePipeline p = new QuotePipeline(WATCHES, new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE,
                failingOnce, clock);
        p.recover();
        QuoteBatch batch = new QuoteBatch("test", List.of(new QuoteMessage("sent-twice", "test", null, "GOVT-A", LocalDate.of(2026, 3, 2),
                new java.util.TreeMap<>(Map.of(Tenor.years(10), 400.0, Tenor.months(3), 410.0, Tenor.years(2), 405.0)))), List.of());

        assertThatThrownBy(() -> p.process(List.of(batch))).hasMessageContaining("the alert stage failed");
        BatchOutcome again = p.process(List.of(batch));

        assertThat(again.accepted()).as("the message sent again after the failed step is accepted").isEqualTo(1);
        assertThat(again.duplicates()).as("and not taken for a duplicate").isZero();
        assertThat(new JournalReader(ds).quoteCount()).as("quote messages journalled").isEqualTo(1);
        assertThat(p.spreads()).as("the monitors saw the quote once").isEqualTo(pipeline(ds).spreads());
    }

    @Test
    void recoveryFollowsTheProcessingOrderEvenWhereRowIdsDoNot() throws Exception {
        // PostgreSQL hands identity values to each connection in cached blocks, so a later quote can
        // get a lower id than an earlier one; here every id is reversed against the processing order
        List<QuoteBatch> batches = scenario(11);
        AgroalDataSource straight = database("in-order");
        QuotePipeline uninterrupted = pipeline(straight);
        batches.forEach(b -> uninterrupted.process(List.of(b)));
        AgroalDataSource shuffled = database("ids-reversed");
        String columns = "seq, message_id, origin, source, sent_at, curve, market_date, yields, recorded_at";
        try (java.sql.Connection from = straight.getConnection(); java.sql.Connection to = shuffled.getConnection();
             java.sql.Statement read = from.createStatement();
             java.sql.ResultSet rs = read.executeQuery("SELECT id, " + columns + " FROM quote");
             java.sql.PreparedStatement write = to.prepareStatement("INSERT INTO quote (id, " + columns + ") VALUES (?,?,?,?,?,?,?,?,?,?)")) {
            while (rs.next()) {
                write.setLong(1, 10_000_000 - rs.getLong(1));
                for (int i = 2; i <= 10; i++) {
                    write.setObject(i, rs.getObject(i));
                }
                write.addBatch();
            }
            write.executeBatch();
        }

        assertThat(pipeline(shuffled).spreads()).isEqualTo(uninterrupted.spreads());
    }

    @Test
    void aRestartRemembersWhenEachCurveWasLastQuoted() {
        AgroalDataSource ds = database("last-quoted");
        scenario(3).subList(0, 40).forEach(b -> pipeline(ds).process(List.of(b)));

        // the feed's quiet time runs from the journalled quote, not from the restart
        assertThat(pipeline(ds).lastReceived()).containsOnlyKeys("GOVT-A", "GOVT-B").containsValue(clock.instant());
    }

    @Test
    void alertsSeeTheSameStepsHoweverTheQuotesAreBatched() {
        // live quotes come a few at a time; a backlog after a restart comes in polls of hundreds
        List<QuoteBatch> batches = scenario(5);
        List<String> oneByOne = new ArrayList<>();
        AgroalDataSource single = database("one-by-one");
        QuotePipeline live = new QuotePipeline(WATCHES, new JournalWriter(single, clock), new JournalReader(single),
                PipelineListener.NONE, recording(oneByOne), clock);
        batches.forEach(b -> live.process(List.of(b)));
        List<String> inBulk = new ArrayList<>();
        AgroalDataSource bulk = database("in-bulk");
        QuotePipeline catchingUp = new QuotePipeline(WATCHES, new JournalWriter(bulk, clock), new JournalReader(bulk),
                PipelineListener.NONE, recording(inBulk), clock);
        for (int from = 0; from < batches.size(); from += 150) {
            catchingUp.process(batches.subList(from, Math.min(batches.size(), from + 150)));
        }

        assertThat(inBulk).isEqualTo(oneByOne).anyMatch(s -> s.contains("CONFIRMED"));
    }

    /** An alert stage that writes down every status it is shown, in order. */
    private static AlertStage recording(List<String> seen) {
        return onStepOnly((changed, sequence, journal) ->
                changed.forEach(c -> seen.add(c.id() + " " + c.date() + " " + c.state() + " " + c.valueBp())));
    }

    /**
     * What a hostile sender writes comes back in reject details and raw input. A PostgreSQL text
     * column refuses NUL, and a refused write used to fail the whole step (HTTP 503, and with Kafka
     * a stopped consumer), good quotes of the same request with it: the journal now keeps NUL as
     * U+FFFD. Texts that would be kept as they are (a quote's id, source, curve) are refused by
     * the decoder instead, as is a market date the journal cannot store faithfully.
     */
    @Test
    void hostileTextIsJournalledAsARejectAndTheGoodQuoteBesideItIsKept() {
        AgroalDataSource ds = database("hostile");
        QuotePipeline p = pipeline(ds);
        QuoteDecoder decoder = new QuoteDecoder(new IngestRules(Set.of("GOVT-A"), org.slopewatch.curve.YieldBounds.DEFAULT, 3, clock));
        QuoteBatch items = decoder.decode("test", """
                [{"curve":"GOVT-\\u0000","tenor":"10Y","date":"2026-03-02","yield":4.2},
                 {"curve":"GOVT-A","tenor":"10Y","date":"2026-03-02","yield":4.2,"source":"feed\\u0000"},
                 {"curve":"GOVT-A","tenor":"10Y","date":"-9999-01-03","yield":4.2},
                 {"curve":"GOVT-A","tenor":"10Y","date":"2026-03-02","yield":4.2,"id":"good-1"}]""");
        QuoteBatch notJson = decoder.decode("test", "{\"curve\":\"GOVT-A\u0000\"}");
        BatchOutcome o = p.process(List.of(items, notJson));

        assertThat(o.accepted()).as("the good quote is kept").isEqualTo(1);
        assertThat(o.rejected()).isEqualTo(4);
        List<JournalReader.StoredReject> stored = new JournalReader(ds).rejects(10);
        assertThat(stored).hasSize(4);
        assertThat(stored).extracting(JournalReader.StoredReject::reason)
                .containsExactlyInAnyOrder("unknown-curve", "malformed", "bad-date", "malformed");
        // the detail quotes the curve as an excerpt, its NUL escaped; the raw text keeps it as U+FFFD
        assertThat(stored).anyMatch(r -> r.detail().equals("unknown curve 'GOVT-\\u0000'"))
                .anyMatch(r -> r.raw() != null && r.raw().contains("GOVT-A\uFFFD"))
                .allMatch(r -> !r.detail().contains("\u0000") && (r.raw() == null || !r.raw().contains("\u0000")));
        assertThat(new JournalReader(ds).quoteCount()).isEqualTo(1);
    }

    private static List<String> outcomes(JournalReader journal) {
        return journal.transitions(null, LocalDate.of(1, 1, 1), LocalDate.of(9999, 1, 1), true, 100_000)
                .stream().map(t -> t.spreadId() + " " + t.date() + " " + t.from() + "->" + t.to() + " " + t.test() + " spell "
                        + t.spellId() + " seq " + t.seq() + (t.supersededBy() == null ? "" : " superseded")).toList();
    }

    /** What a step hands the alert stage. */
    interface StepWatcher {
        void onStep(java.util.Collection<SpreadStatus> changed, long sequence, JournalEntries journal);
    }

    /** An alert stage that only watches steps: no clock, nothing written, nothing to rebuild. */
    static AlertStage onStepOnly(StepWatcher watcher) {
        return new AlertStage() {
            @Override
            public void onStep(java.util.Collection<SpreadStatus> changed, long sequence, JournalEntries journal) {
                watcher.onStep(changed, sequence, journal);
            }
            @Override
            public void onTick(java.util.Collection<SpreadStatus> all, Map<String, LocalDate> staleCurves, JournalEntries journal) {
            }

            @Override
            public void written(List<JournalEntries.AlertEntry> alerts) {
            }

            @Override
            public void rebuild() {
            }
        };
    }

    /**
     * A step whose rows go to the journal's writer thread in parts while it is decided (every step
     * here: one row is enough) journals exactly what the same step written whole at its end
     * journals: the same quote and spread-value rows in the same order, transitions (superseded
     * ones included) and spells, and leaves the same states. Steps of many batches, with revisions
     * older than the memory, which read the journal while a step's transaction is open.
     */
    @Test
    void aStepWrittenAheadInPartsJournalsWhatOneWrittenWholeDoes() {
        for (long seed : new long[] {4, 13}) {
            List<QuoteBatch> batches = scenarioWithOldRevisions(seed);
            AgroalDataSource wholeDs = database("step-whole-" + seed);
            AgroalDataSource partsDs = database("step-parts-" + seed);
            QuotePipeline whole = stepping(wholeDs, Integer.MAX_VALUE, AlertStage.NONE);
            QuotePipeline parts = stepping(partsDs, 1, AlertStage.NONE);
            Random random = new Random(seed);
            for (int from = 0; from < batches.size(); ) {
                int to = Math.min(batches.size(), from + 1 + random.nextInt(40));
                List<QuoteBatch> step = batches.subList(from, to);
                whole.process(step);
                parts.process(step);
                from = to;
            }
            assertThat(parts.spreads()).as("seed %d: states", seed).isEqualTo(whole.spreads());
            assertThat(rows(partsDs)).as("seed %d: quote and spread-value rows, in order", seed).isEqualTo(rows(wholeDs));
            org.slopewatch.testsupport.JournalContents expected = org.slopewatch.testsupport.JournalContents.read(wholeDs);
            org.slopewatch.testsupport.JournalContents actual = org.slopewatch.testsupport.JournalContents.read(partsDs);
            assertThat(actual.transitions()).as("seed %d: transitions", seed).isEqualTo(expected.transitions()).isNotEmpty();
            assertThat(actual.spells()).as("seed %d: spells", seed).isEqualTo(expected.spells());
        }
    }

    /**
     * A step that fails after parts of it were handed to the writer thread leaves nothing of itself
     * in the journal, whichever side failed: the journal (a curve name longer than its column, in
     * the step's last message) or the deciding (the alert stage throwing on the step's last
     * message). The states go back to what the journal holds, and the quotes that follow are taken
     * as if the step had never come.
     */
    @Test
    void aStepThatFailsAfterPartsWereWrittenAheadLeavesNothingOfItself() {
        List<QuoteBatch> batches = scenario(6);
        AgroalDataSource referenceDs = database("failed-step-reference");
        QuotePipeline reference = stepping(referenceDs, Integer.MAX_VALUE, AlertStage.NONE);
        boolean[] decidingFails = new boolean[1];
        AlertStage failing = failingWhen(() -> decidingFails[0], "the deciding side failed");
        AgroalDataSource ds = database("failed-step");
        QuotePipeline p = stepping(ds, 1, failing);
        reference.process(batches.subList(0, 100));
        p.process(batches.subList(0, 100));
        JournalReader journal = new JournalReader(ds);
        long before = journal.quoteCount();
        List<SpreadStatus> states = p.spreads();

        // the journal refuses the step's last message: a curve name longer than the quote table's column (100)
        QuoteMessage last = batches.get(150).messages().get(0);
        QuoteBatch tooLong = new QuoteBatch("http", List.of(new QuoteMessage(null, null, null, "G".repeat(101), last.date(), last.yieldsBp())),
                List.of());
        List<QuoteBatch> refused = new ArrayList<>(batches.subList(100, 150));
        refused.add(tooLong);
        assertThatThrownBy(() -> p.process(refused)).as("a step the journal refuses");
        assertThat(journal.quoteCount()).as("quotes after the refused step").isEqualTo(before);
        assertThat(p.spreads()).as("states after the refused step").isEqualTo(states);

        // the deciding side fails on the step's last message, after its first ones went to the writer thread
        List<QuoteBatch> failed = new ArrayList<>(batches.subList(100, 150));
        decidingFails[0] = true;
        assertThatThrownBy(() -> p.process(failed)).hasMessageContaining("the deciding side failed");
        decidingFails[0] = false;
        assertThat(journal.quoteCount()).as("quotes after the failed step").isEqualTo(before);
        assertThat(p.spreads()).as("states after the failed step").isEqualTo(states);

        reference.process(batches.subList(100, batches.size()));
        p.process(batches.subList(100, batches.size()));
        assertThat(p.spreads()).isEqualTo(reference.spreads());
        assertThat(rows(ds)).isEqualTo(rows(referenceDs));
    }

    private QuotePipeline stepping(AgroalDataSource ds, int aheadRows, AlertStage alerts) {
        QuotePipeline p = new QuotePipeline(WATCHES, new JournalWriter(ds, clock, 0, aheadRows), new JournalReader(ds), PipelineListener.NONE,
                alerts, clock, new QuotePipeline.Memory(1_000, QuotePipeline.Memory.MIN_DAYS, new CurveCheckpoints(ds, clock)));
        p.recover();
        return p;
    }

    /** The journal's quote and spread-value rows in the order of their ids, without ids and times. */
    private static List<String> rows(AgroalDataSource ds) {
        List<String> rows = new ArrayList<>();
        try (java.sql.Connection c = ds.getConnection(); java.sql.Statement s = c.createStatement()) {
            try (java.sql.ResultSet rs = s.executeQuery("SELECT seq, message_id, origin, curve, market_date, yields FROM quote ORDER BY id")) {
                while (rs.next()) {
                    rows.add("quote " + rs.getLong(1) + " " + rs.getString(2) + " " + rs.getString(3) + " " + rs.getString(4) + " "
                            + rs.getObject(5, LocalDate.class) + " " + rs.getString(6));
                }
            }
            try (java.sql.ResultSet rs = s.executeQuery("SELECT spread_id, market_date, value_bp, seq FROM observation ORDER BY id")) {
                while (rs.next()) {
                    rows.add("value " + rs.getString(1) + " " + rs.getObject(2, LocalDate.class) + " " + rs.getDouble(3) + " " + rs.getLong(4));
                }
            }
        } catch (java.sql.SQLException e) {
            throw new IllegalStateException(e);
        }
        return rows;
    }

    /** An alert stage that decides nothing and throws {@code message} from a step whenever {@code fail} says so. */
    private static AlertStage failingWhen(java.util.function.BooleanSupplier fail, String message) {
        return onStepOnly((changed, sequence, journal) -> {
            if (fail.getAsBoolean()) {
                throw new IllegalStateException(message);
            }
        });
    }
}
