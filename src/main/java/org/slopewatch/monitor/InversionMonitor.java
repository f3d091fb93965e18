package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slopewatch.curve.Resolution;
import org.slopewatch.spread.SpreadKey;

/**
 * The per-spread state machine: {@code NORMAL → INVERTED → CONFIRMED → RESTEEPENING → NORMAL},
 * with {@code INVERTED → NORMAL} for a spell that ends unconfirmed and
 * {@code RESTEEPENING → INVERTED} for a new spell inside the hold period.
 *
 * <p>Immutable and shareable; the state of each spread is passed in. Observations must arrive in
 * strictly increasing date order: replacing or revising a value is {@link SpreadTrack}'s job.
 * Every step without news returns the same empty list, so the common path allocates nothing.
 *
 * <p>Values and thresholds are compared in whole steps of {@link Resolution#BASIS_POINTS} and sums
 * kept in them, so a spread or an average that stands exactly on a threshold is on it, never a
 * binary hair to one side.
 */
public final class InversionMonitor {

    private final MonitorDefinition definition;
    private final PersistenceTest[] tests;
    private final double entry;
    /** The thresholds in steps of the resolution, which every observation is compared in. */
    private final long entryUnits;
    private final long exitUnits;
    /** The thresholds as reasons write them, worked out once rather than per transition. */
    private final String entryText;
    private final String exitText;
    /** Whether any test keeps a trailing window, so that the common rules skip the loop over none. */
    private final boolean hasWindows;

    public InversionMonitor(MonitorDefinition definition) {
        this.definition = definition;
        this.tests = definition.tests().toArray(new PersistenceTest[0]);
        this.entry = definition.entryBelowBp();
        this.entryUnits = Resolution.BASIS_POINTS.units(entry);
        this.exitUnits = Resolution.BASIS_POINTS.units(definition.exitAboveBp());
        this.entryText = PersistenceTest.number(entry);
        this.exitText = PersistenceTest.number(definition.exitAboveBp());
        this.hasWindows = definition.tests().stream().anyMatch(t -> t.windowDays() > 0);
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
     * <p>This is the hot path (tens of millions of calls a second in a replay), so it does only
     * what every observation needs and hands the rest to methods that run on news: a new month
     * ({@link #enterMonth}) and a spread that is inverted or not {@code NORMAL} ({@link #advance}).
     * Kept small so that the JIT can inline it into the caller's loop.
     *
     * @throws IllegalArgumentException if the observation is not dated after the previous one
     */
    public List<MonitorEvent> observe(MonitorState s, Observation o) {
        LocalDate date = o.date();
        // the epoch day and the quarter change month by month: worked out once per month, the
        // epoch day of any other day of the month is then an addition (LocalDate.toEpochDay
        // costs divisions and a leap-year test on every call)
        int month = date.getYear() * 12 + date.getMonthValue() - 1;
        List<MonitorEvent> events = month == s.monthIndex ? List.of() : enterMonth(s, o, month);
        int day = s.monthFirstDay + date.getDayOfMonth() - 1;
        if (day <= s.lastDay) {
            throw outOfOrder(s, date); // a date earlier in the same month (enterMonth checks the others)
        }
        double v = o.valueBp();
        long units = Resolution.BASIS_POINTS.units(v);
        s.quarterUnits += units;
        s.quarterCount++;
        boolean inverted = units < entryUnits;
        if (hasWindows) {
            addToWindows(s, day, units, inverted);
        }
        if (!inverted) {
            s.invertedSinceDay = MonitorState.NONE;
        } else if (s.invertedSinceDay == MonitorState.NONE) {
            s.invertedSinceDay = day;
        }
        int previousDay = s.lastDay;
        s.lastDay = day;
        s.lastValueBp = v;
        // NORMAL and not below the entry threshold is the usual day: nothing else to look at
        if (inverted || s.state != SpreadState.NORMAL) {
            events = advance(s, o, day, previousDay, v, units, inverted, events);
        }
        return events;
    }

    /**
     * The first observation of a calendar month: checks the date order (before anything changes),
     * caches the month's first epoch day, and closes the quarter when a new one begins.
     */
    private List<MonitorEvent> enterMonth(MonitorState s, Observation o, int month) {
        LocalDate date = o.date();
        int day = (int) date.toEpochDay();
        if (s.lastDay != MonitorState.NONE && day <= s.lastDay) {
            throw outOfOrder(s, date);
        }
        s.monthIndex = month;
        s.monthFirstDay = day - date.getDayOfMonth() + 1;
        if (s.firstDay == MonitorState.NONE) {
            s.firstDay = day;
        }
        List<MonitorEvent> events = List.of();
        int quarter = Math.floorDiv(month, 3); // year·4 + quarter − 1, as Quarter.index()
        if (quarter != s.quarterIndex) {
            if (s.quarterIndex != MonitorState.NONE && s.quarterCounts) {
                events = closeQuarter(s, o, day, events);
            }
            // a series that starts after a quarter's first month has not seen the whole quarter
            s.quarterCounts = s.quarterIndex != MonitorState.NONE || Math.floorMod(month, 3) == 0;
            s.quarterIndex = quarter;
            s.quarterUnits = 0;
            s.quarterCount = 0;
        }
        return events;
    }

    private static IllegalArgumentException outOfOrder(MonitorState s, LocalDate date) {
        return new IllegalArgumentException(s.spread + ": observation for " + date + " arrived after "
                + LocalDate.ofEpochDay(s.lastDay) + "; observations must arrive in date order");
    }

    private static void addToWindows(MonitorState s, int day, long units, boolean inverted) {
        for (TrailingWindow w : s.windows) {
            if (w != null) {
                w.add(day, units, inverted);
            }
        }
    }

    /** The state machine's step, for an observation below the entry threshold or a state other than NORMAL. */
    private List<MonitorEvent> advance(MonitorState s, Observation o, int day, int previousDay, double v, long units, boolean inverted,
                                       List<MonitorEvent> events) {
        switch (s.state) {
            case NORMAL -> {
                if (inverted) {
                    String reason = spreadText(v).toString();
                    events = startSpell(s, o, day, SpreadState.NORMAL, reason, events);
                    events = evaluatePersistence(s, o, day, events);
                }
            }
            case INVERTED, CONFIRMED -> {
                extendSpell(s, previousDay, day, v, units);
                if (units >= exitUnits) {
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
                    String reason = spreadText(v).append(" again, ").append(since).append(" days after re-steepening").toString();
                    events = startSpell(s, o, day, SpreadState.RESTEEPENING, reason, events);
                    events = evaluatePersistence(s, o, day, events);
                } else if ((long) day - s.resteepenedDay >= definition.holdDays()) {
                    LocalDate resteepened = LocalDate.ofEpochDay(s.resteepenedDay);
                    Evidence e = new Evidence("hold", "since " + resteepened,
                            (long) day - s.resteepenedDay, definition.holdDays(), v, 0);
                    String reason = "hold period of " + definition.holdDays() + " days since re-steepening on " + resteepened + " is over";
                    events = add(events, transition(s, o, SpreadState.NORMAL, reason, e, 0));
                    s.resteepenedDay = MonitorState.NONE;
                }
            }
        }
        return events;
    }

    /** {@code spread -3.2 bp below entry threshold 0 bp}. */
    private StringBuilder spreadText(double v) {
        return DecimalText.append(new StringBuilder(96).append("spread "), v, 1)
                .append(" bp below entry threshold ").append(entryText).append(" bp");
    }

    private List<MonitorEvent> closeQuarter(MonitorState s, Observation o, int day, List<MonitorEvent> events) {
        Quarter closed = Quarter.ofIndex(s.quarterIndex);
        double average = Resolution.BASIS_POINTS.average(s.quarterUnits, s.quarterCount);
        events = add(events, new QuarterSummary(s.spread, closed, average, s.quarterCount));
        if (s.state != SpreadState.INVERTED) {
            return events;
        }
        for (PersistenceTest t : tests) {
            if (t instanceof QuarterAverage q && Resolution.BASIS_POINTS.averageBelow(s.quarterUnits, s.quarterCount, q.belowBp())) {
                Evidence e = new Evidence(q.name(), closed.toString(), average, q.belowBp(), s.lastValueBp, s.daysInverted());
                String reason = DecimalText.append(new StringBuilder(64).append("quarter average "), average, 1)
                        .append(" bp < ").append(PersistenceTest.number(q.belowBp())).append(" bp (").append(closed).append(')').toString();
                return confirm(s, o, day, e, reason, events);
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
                    String reason = "inverted for " + days + " days >= " + d.days() + " days (since " + LocalDate.ofEpochDay(s.invertedSinceDay) + ")";
                    return confirm(s, o, day, e, reason, events);
                }
            } else if (t instanceof RollingAverage r) {
                TrailingWindow w = s.windows[i];
                if (hasWholeWindow(s, day, r.windowDays()) && w.averageBelow(r.belowBp())) {
                    Evidence e = new Evidence(r.name(), r.windowDays() + "d", w.average(), r.belowBp(), v, s.daysInverted());
                    String reason = DecimalText.append(new StringBuilder(64).append(r.windowDays()).append("-day average "), w.average(), 1)
                            .append(" bp < ").append(PersistenceTest.number(r.belowBp())).append(" bp (").append(w.size()).append(" observations)")
                            .toString();
                    return confirm(s, o, day, e, reason, events);
                }
            } else if (t instanceof ShareInverted sh) {
                TrailingWindow w = s.windows[i];
                if (hasWholeWindow(s, day, sh.windowDays()) && w.invertedShareAtLeast(sh.share())) {
                    Evidence e = new Evidence(sh.name(), sh.windowDays() + "d", w.invertedShare(), sh.share(), v, s.daysInverted());
                    StringBuilder reason = DecimalText.append(new StringBuilder(64), 100 * w.invertedShare(), 0)
                            .append("% of ").append(w.size()).append(" observations inverted over ").append(sh.windowDays()).append(" days >= ");
                    return confirm(s, o, day, e, DecimalText.append(reason, 100 * sh.share(), 0).append('%').toString(), events);
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
        s.spellAreaUnits = 0;
        s.spellLastDepthUnits = Math.max(0, entryUnits - Resolution.BASIS_POINTS.units(o.valueBp()));
        s.aboveExitRun = 0;
        s.resteepenedDay = MonitorState.NONE;
        Evidence e = new Evidence("entry", "observation", o.valueBp(), entry, o.valueBp(), 0);
        return add(events, transition(s, o, SpreadState.INVERTED, reason, e, s.spellCount));
    }

    private void extendSpell(MonitorState s, int previousDay, int day, double v, long units) {
        s.spellAreaUnits += s.spellLastDepthUnits * ((long) day - previousDay);
        s.spellLastDepthUnits = Math.max(0, entryUnits - units);
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
        String reason = DecimalText.append(new StringBuilder(128).append("back at or above exit threshold ").append(exitText)
                        .append(" bp for ").append(runs).append(" ("), o.valueBp(), 1)
                .append(" bp); ").append(confirmed ? "confirmed" : "unconfirmed").append(" spell of ").append(spell.durationDays())
                .append(" days ended").toString();
        Evidence e = new Evidence("exit", runs, o.valueBp(), definition.exitAboveBp(), o.valueBp(), 0);
        events = add(events, transition(s, o, to, reason, e, s.spellCount));
        events = add(events, spell);
        s.endedSpell = spell;
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
