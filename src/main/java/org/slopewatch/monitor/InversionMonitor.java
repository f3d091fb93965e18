package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.slopewatch.spread.SpreadKey;

/**
 * The per-spread state machine: {@code NORMAL → INVERTED → CONFIRMED → RESTEEPENING → NORMAL},
 * with {@code INVERTED → NORMAL} for a spell that ends unconfirmed and
 * {@code RESTEEPENING → INVERTED} for a new spell inside the hold period.
 *
 * <p>Immutable and shareable; the state of each spread is passed in. Observations must arrive in
 * strictly increasing date order: replacing or revising a value is {@link SpreadTrack}'s job.
 * Every step without news returns the same empty list, so the common path allocates nothing.
 */
public final class InversionMonitor {

    private final MonitorDefinition definition;
    private final PersistenceTest[] tests;
    private final double entry;
    private final double exit;

    public InversionMonitor(MonitorDefinition definition) {
        this.definition = definition;
        this.tests = definition.tests().toArray(new PersistenceTest[0]);
        this.entry = definition.entryBelowBp();
        this.exit = definition.exitAboveBp();
    }

    public MonitorDefinition definition() {
        return definition;
    }

    /** A fresh state for a spread, in {@code NORMAL} with no history. */
    public MonitorState newState(SpreadKey spread) {
        return new MonitorState(spread, definition);
    }

    /**
     * Consumes one observation and returns what it caused, in order: the close of a quarter (and
     * a confirmation it brings), then transitions and ended spells.
     *
     * @throws IllegalArgumentException if the observation is not dated after the previous one
     */
    public List<MonitorEvent> observe(MonitorState s, Observation o) {
        LocalDate date = o.date();
        int day = (int) date.toEpochDay();
        if (s.lastDay != MonitorState.NONE && day <= s.lastDay) {
            throw new IllegalArgumentException(s.spread + ": observation for " + date + " arrived after "
                    + LocalDate.ofEpochDay(s.lastDay) + "; observations must arrive in date order");
        }
        double v = o.valueBp();
        int previousDay = s.lastDay;
        List<MonitorEvent> events = List.of();

        int quarter = date.getYear() * 4 + (date.getMonthValue() - 1) / 3;
        if (quarter != s.quarterIndex) {
            if (s.quarterIndex != MonitorState.NONE && s.quarterCounts) {
                events = closeQuarter(s, o, day, events);
            }
            // a series that starts after a quarter's first month has not seen the whole quarter
            s.quarterCounts = s.quarterIndex != MonitorState.NONE || (date.getMonthValue() - 1) % 3 == 0;
            s.quarterIndex = quarter;
            s.quarterSum = 0;
            s.quarterCount = 0;
        }
        s.quarterSum += v;
        s.quarterCount++;

        boolean inverted = v < entry;
        if (s.firstDay == MonitorState.NONE) {
            s.firstDay = day;
        }
        for (TrailingWindow w : s.windows) {
            if (w != null) {
                w.add(day, v, inverted);
            }
        }
        if (inverted) {
            if (s.invertedSinceDay == MonitorState.NONE) {
                s.invertedSinceDay = day;
            }
        } else {
            s.invertedSinceDay = MonitorState.NONE;
        }
        s.lastDay = day;
        s.lastValueBp = v;

        switch (s.state) {
            case NORMAL -> {
                if (inverted) {
                    events = startSpell(s, o, day, SpreadState.NORMAL,
                            String.format(Locale.ROOT, "spread %.1f bp below entry threshold %s bp", v, PersistenceTest.number(entry)), events);
                    events = evaluatePersistence(s, o, day, events);
                }
            }
            case INVERTED, CONFIRMED -> {
                extendSpell(s, previousDay, day, v);
                if (v >= exit) {
                    s.aboveExitRun++;
                    if (s.aboveExitRun >= definition.exitObservations()) {
                        events = endSpell(s, o, day, events);
                    }
                } else {
                    s.aboveExitRun = 0;
                }
                if (s.state == SpreadState.INVERTED) {
                    events = evaluatePersistence(s, o, day, events);
                }
            }
            case RESTEEPENING -> {
                if (inverted) {
                    long since = (long) day - s.resteepenedDay;
                    events = startSpell(s, o, day, SpreadState.RESTEEPENING, String.format(Locale.ROOT,
                            "spread %.1f bp below entry threshold %s bp again, %d days after re-steepening", v, PersistenceTest.number(entry), since), events);
                    events = evaluatePersistence(s, o, day, events);
                } else if ((long) day - s.resteepenedDay >= definition.holdDays()) {
                    Evidence e = new Evidence("hold", "since " + LocalDate.ofEpochDay(s.resteepenedDay),
                            (long) day - s.resteepenedDay, definition.holdDays(), v, 0);
                    events = add(events, transition(s, o, SpreadState.NORMAL, String.format(Locale.ROOT,
                            "hold period of %d days since re-steepening on %s is over", definition.holdDays(),
                            LocalDate.ofEpochDay(s.resteepenedDay)), e, 0));
                    s.resteepenedDay = MonitorState.NONE;
                }
            }
        }
        return events;
    }

    private List<MonitorEvent> closeQuarter(MonitorState s, Observation o, int day, List<MonitorEvent> events) {
        Quarter closed = Quarter.ofIndex(s.quarterIndex);
        double average = s.quarterSum / s.quarterCount;
        events = add(events, new QuarterSummary(s.spread, closed, average, s.quarterCount));
        if (s.state != SpreadState.INVERTED) {
            return events;
        }
        for (PersistenceTest t : tests) {
            if (t instanceof QuarterAverage q && average < q.belowBp()) {
                Evidence e = new Evidence(q.name(), closed.toString(), average, q.belowBp(), s.lastValueBp, s.daysInverted());
                return confirm(s, o, day, e, String.format(Locale.ROOT, "quarter average %.1f bp < %s bp (%s)",
                        average, PersistenceTest.number(q.belowBp()), closed), events);
            }
        }
        return events;
    }

    private List<MonitorEvent> evaluatePersistence(MonitorState s, Observation o, int day, List<MonitorEvent> events) {
        double v = o.valueBp();
        for (int i = 0; i < tests.length; i++) {
            PersistenceTest t = tests[i];
            if (t instanceof DaysInverted d) {
                long days = s.daysInverted();
                if (s.invertedSinceDay != MonitorState.NONE && days >= d.days()) {
                    Evidence e = new Evidence(d.name(), "since " + LocalDate.ofEpochDay(s.invertedSinceDay), days, d.days(), v, days);
                    return confirm(s, o, day, e, String.format(Locale.ROOT, "inverted for %d days >= %d days (since %s)",
                            days, d.days(), LocalDate.ofEpochDay(s.invertedSinceDay)), events);
                }
            } else if (t instanceof RollingAverage r) {
                TrailingWindow w = s.windows[i];
                if (hasWholeWindow(s, day, r.windowDays()) && w.average() < r.belowBp()) {
                    Evidence e = new Evidence(r.name(), r.windowDays() + "d", w.average(), r.belowBp(), v, s.daysInverted());
                    return confirm(s, o, day, e, String.format(Locale.ROOT, "%d-day average %.1f bp < %s bp (%d observations)",
                            r.windowDays(), w.average(), PersistenceTest.number(r.belowBp()), w.size()), events);
                }
            } else if (t instanceof ShareInverted sh) {
                TrailingWindow w = s.windows[i];
                if (hasWholeWindow(s, day, sh.windowDays()) && w.invertedShare() >= sh.share()) {
                    Evidence e = new Evidence(sh.name(), sh.windowDays() + "d", w.invertedShare(), sh.share(), v, s.daysInverted());
                    return confirm(s, o, day, e, String.format(Locale.ROOT, "%.0f%% of %d observations inverted over %d days >= %.0f%%",
                            100 * w.invertedShare(), w.size(), sh.windowDays(), 100 * sh.share()), events);
                }
            }
        }
        return events;
    }

    /** A trailing-window test needs the monitor to have seen a whole window, or one early value would decide. */
    private static boolean hasWholeWindow(MonitorState s, int day, int windowDays) {
        return (long) day - s.firstDay + 1 >= windowDays;
    }

    private List<MonitorEvent> confirm(MonitorState s, Observation o, int day, Evidence e, String reason, List<MonitorEvent> events) {
        s.spellConfirmedDay = day;
        s.spellConfirmedBy = e.test();
        return add(events, transition(s, o, SpreadState.CONFIRMED, reason, e, s.spellCount));
    }

    private List<MonitorEvent> startSpell(MonitorState s, Observation o, int day, SpreadState from, String reason,
                                          List<MonitorEvent> events) {
        s.spellCount++;
        s.spellStartDay = day;
        s.spellConfirmedDay = MonitorState.NONE;
        s.spellConfirmedBy = null;
        s.spellObservations = 1;
        s.spellDeepestBp = o.valueBp();
        s.spellDeepestDay = day;
        s.spellAreaBpDays = 0;
        s.spellLastDepthBp = Math.max(0, entry - o.valueBp());
        s.aboveExitRun = 0;
        s.resteepenedDay = MonitorState.NONE;
        Evidence e = new Evidence("entry", "observation", o.valueBp(), entry, o.valueBp(), 0);
        return add(events, transition(s, o, SpreadState.INVERTED, reason, e, s.spellCount));
    }

    private void extendSpell(MonitorState s, int previousDay, int day, double v) {
        s.spellAreaBpDays += s.spellLastDepthBp * ((long) day - previousDay);
        s.spellLastDepthBp = Math.max(0, entry - v);
        s.spellObservations++;
        if (v < s.spellDeepestBp) {
            s.spellDeepestBp = v;
            s.spellDeepestDay = day;
        }
    }

    private List<MonitorEvent> endSpell(MonitorState s, Observation o, int day, List<MonitorEvent> events) {
        boolean confirmed = s.state == SpreadState.CONFIRMED;
        Spell spell = s.spell(day, true);
        SpreadState to = confirmed ? SpreadState.RESTEEPENING : SpreadState.NORMAL;
        String runs = definition.exitObservations() == 1 ? "1 observation" : definition.exitObservations() + " observations";
        String reason = String.format(Locale.ROOT, "back at or above exit threshold %s bp for %s (%.1f bp); %s spell of %d days ended",
                PersistenceTest.number(exit), runs, o.valueBp(), confirmed ? "confirmed" : "unconfirmed", spell.durationDays());
        Evidence e = new Evidence("exit", runs, o.valueBp(), exit, o.valueBp(), 0);
        events = add(events, transition(s, o, to, reason, e, s.spellCount));
        events = add(events, spell);
        s.spellStartDay = MonitorState.NONE;
        s.aboveExitRun = 0;
        if (confirmed) {
            s.resteepenedDay = day;
        }
        return events;
    }

    private static Transition transition(MonitorState s, Observation o, SpreadState to, String reason, Evidence e, long spellId) {
        Transition t = new Transition(s.spread, o.date(), s.state, to, reason, e, spellId, o.sequence());
        s.state = to;
        s.stateSinceDay = (int) o.date().toEpochDay();
        return t;
    }

    private static List<MonitorEvent> add(List<MonitorEvent> events, MonitorEvent e) {
        List<MonitorEvent> out = events.isEmpty() ? new ArrayList<>(4) : events;
        out.add(e);
        return out;
    }
}
