package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.slopewatch.spread.SpreadKey;

/**
 * A track that lets go of what is older than its window holds as much after forty years as after
 * two, and reports what a track holding everything reports: the same transitions, spells and
 * revisions, event for event, revisions inside the window and before it included. The references
 * are the track that never lets go (the engine as offline replay runs it), fed the same values, and
 * for the spells a journal holds, after every value, the ended spells of the track holding
 * everything, figures included: a late value that changes a spell's figures and no transition is
 * written at once (a restatement), not left stale until the next revision.
 */
class SpreadTrackMemoryTest {

    private static final SpreadKey KEY = new SpreadKey("GOVT-A", "10Y-3M");
    private static final InversionMonitor MONITOR = new InversionMonitor(new MonitorDefinition(0, 5, 2, 60,
            List.of(new QuarterAverage(0), new DaysInverted(45))));
    /** The daemon's default days held ({@code slopewatch.ingest.memory-days}). */
    private static final int WINDOW = 400;

    /** Every value recorded, in order: what the journal holds, which the bounded track reads back. */
    private final List<Observation> journal = new ArrayList<>();
    /** Spells written over with changed figures though no transition changed. */
    private int restated;

    private List<Observation> standing(LocalDate through, long beforeSequence) {
        Map<LocalDate, Observation> latest = new TreeMap<>();
        for (Observation o : journal) {
            if (!o.date().isAfter(through) && o.sequence() < beforeSequence) {
                latest.put(o.date(), o);
            }
        }
        return List.copyOf(latest.values());
    }

    @Test
    void memoryStaysBoundedOverFortyYearsAndEveryEventIsTheWholeTracksEvent() {
        SpreadTrack whole = new SpreadTrack(MONITOR, KEY);
        SpreadTrack bounded = new SpreadTrack(MONITOR, KEY, (spread, through, before) -> standing(through, before));
        Random random = new Random(40);
        LocalDate date = LocalDate.of(1986, 1, 1);
        LocalDate end = date.plusYears(40);
        long seq = 0;
        int mostTransitions = 0;
        int mostSpells = 0;
        int revisionsBeforeWindow = 0;
        int reported = 0;
        Map<Long, Spell> wholeTable = new TreeMap<>();
        Map<Long, Spell> boundedTable = new TreeMap<>();
        Map<Long, Spell> everySpellAgain = new TreeMap<>();
        for (int day = 0; date.isBefore(end); day++) {
            date = date.plusDays(date.getDayOfWeek() == DayOfWeek.FRIDAY ? 3 : date.getDayOfWeek() == DayOfWeek.SATURDAY ? 2 : 1);
            // a spread that inverts for a year or so about every four years, with noise near each crossing
            double value = 20 + 60 * Math.sin(2 * Math.PI * day / 1044.0) + random.nextGaussian() * 6;
            List<Observation> inputs = new ArrayList<>();
            inputs.add(new Observation(date, value, ++seq));
            if (day % 7 == 3) {
                inputs.add(new Observation(date, value - 12, ++seq)); // a replacement of the latest value
            }
            if (day % 37 == 20) {
                inputs.add(new Observation(date.minusDays(7 + random.nextInt(200)), random.nextBoolean() ? -90 : 40, ++seq));
            }
            if (day > 600 && day % 97 == 50) {
                // before the window: read back from the journal, the history re-run
                inputs.add(new Observation(date.minusDays(WINDOW + 100 + random.nextInt(500)), random.nextBoolean() ? -90 : 40, ++seq));
                revisionsBeforeWindow++;
            }
            for (Observation o : inputs) {
                List<MonitorEvent> expected = whole.record(o);
                List<MonitorEvent> actual = bounded.record(o);
                assertThat(actual).as("events of %s on %s", o, date).isEqualTo(expected);
                journal.add(o);
                write(expected, wholeTable);
                write(actual, boundedTable);
                for (MonitorEvent e : expected) {
                    if (e instanceof Spell sp) {
                        everySpellAgain.put(sp.id(), sp);
                    } else if (e instanceof Revision || e instanceof SpellRestatement) {
                        // every spell held written again, as they stand: right whatever the revision changed, and unbounded
                        everySpellAgain.clear();
                        whole.endedSpells().forEach(sp -> everySpellAgain.put(sp.id(), sp));
                    }
                }
                reported += expected.size();
                assertThat(wholeTable.values()).as("the journal's spells after %s on %s", o, date)
                        .containsExactlyInAnyOrderElementsOf(whole.endedSpells());
            }
            bounded.letGoBefore(WINDOW); // after each step, as the daemon does
            if (date.getYear() >= 1990) {
                mostTransitions = Math.max(mostTransitions, bounded.transitions().size());
                mostSpells = Math.max(mostSpells, bounded.endedSpells().size());
            }
        }
        assertThat(bounded.state().state()).isEqualTo(whole.state().state());
        assertThat(boundedTable).as("the spells a journal holds, written from the events").isEqualTo(wholeTable)
                .as("the spells a journal holds when each revision or restatement writes every spell of a track holding everything")
                .isEqualTo(everySpellAgain);
        assertThat(revisionsBeforeWindow).isGreaterThan(100);
        assertThat(restated).as("spells whose figures a late value changed with no transition (twice: both tracks)").isPositive();
        assertThat(reported).isPositive();
        // measured: 393 transitions and 190 spells in all, at most 21 and 11 held (short spells near each crossing)
        assertThat(whole.transitions().size()).as("transitions over forty years").isGreaterThan(300);
        assertThat(whole.endedSpells().size()).as("spells over forty years").isGreaterThan(150);
        // the window and one run of 64 observations (about 500 days) span at most one inversion's crossings
        assertThat(mostTransitions).as("transitions held at most, from the fifth year on").isLessThanOrEqualTo(30);
        assertThat(mostSpells).as("spells held at most, from the fifth year on").isLessThanOrEqualTo(15);
    }

    /**
     * Writes events as the journal does: a spell as it ends, a revision's spells again in place of the
     * rows they replace, a restatement's spells over the rows of their ids.
     */
    private void write(List<MonitorEvent> events, Map<Long, Spell> table) {
        for (MonitorEvent e : events) {
            if (e instanceof Spell s) {
                assertThat(table).as("spell %d written once", s.id()).doesNotContainKey(s.id());
                table.put(s.id(), s);
            } else if (e instanceof Revision r) {
                table.values().removeIf(s -> !s.end().isBefore(r.from()));
                r.spells().forEach(s -> table.put(s.id(), s));
            } else if (e instanceof SpellRestatement r) {
                for (Spell s : r.spells()) {
                    assertThat(table).as("spell %d restated after it was written", s.id()).containsKey(s.id());
                    table.put(s.id(), s);
                    restated++;
                }
            }
        }
    }
}
