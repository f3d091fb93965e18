package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.Objects;
import org.slopewatch.curve.Resolution;
import org.slopewatch.spread.SpreadKey;

/**
 * The running state of one spread's monitor: where it stands, the open spell, the quarter in
 * progress and the trailing windows.
 *
 * <p>Only {@link InversionMonitor} changes it (the mutators are package-private); everyone else
 * reads. It is mutable rather than a fresh value per step because the monitor consumes tens of
 * millions of observations a second and a copy per step would dominate. {@link #copy()} gives an
 * independent snapshot, which is how a caller keeps a checkpoint.
 */
public final class MonitorState {

    static final int NONE = Integer.MIN_VALUE;

    final SpreadKey spread;
    SpreadState state = SpreadState.NORMAL;
    int stateSinceDay = NONE;
    int firstDay = NONE;
    int lastDay = NONE;
    double lastValueBp = Double.NaN;

    /** The calendar month of the last observation (year·12 + month − 1) and the epoch day of its first day. */
    int monthIndex = NONE;
    int monthFirstDay;

    int quarterIndex = NONE;
    boolean quarterCounts;
    /** The quarter's values summed in steps of {@link Resolution#BASIS_POINTS}: exact, however many. */
    long quarterUnits;
    int quarterCount;

    int invertedSinceDay = NONE;
    int aboveExitRun;
    int resteepenedDay = NONE;

    long spellCount;
    int spellStartDay = NONE;
    int spellConfirmedDay = NONE;
    String spellConfirmedBy;
    int spellObservations;
    double spellDeepestBp;
    int spellDeepestDay;
    /** The spell's area and the last observation's depth, in steps of {@link Resolution#BASIS_POINTS} (times days). */
    long spellAreaUnits;
    long spellLastDepthUnits;
    /** The last spell that ended, or null: what a notice about its end reports (set once per spell, so no cost per step). */
    Spell endedSpell;

    final TrailingWindow[] windows;

    MonitorState(SpreadKey spread, MonitorDefinition definition) {
        this.spread = Objects.requireNonNull(spread, "spread");
        this.windows = new TrailingWindow[definition.tests().size()];
        for (int i = 0; i < windows.length; i++) {
            int w = definition.tests().get(i).windowDays();
            if (w > 0) {
                windows[i] = new TrailingWindow(w);
            }
        }
    }

    public SpreadKey spread() {
        return spread;
    }

    public SpreadState state() {
        return state;
    }

    /** The market date of the transition into the current state, or null if it never changed. */
    public LocalDate stateSince() {
        return stateSinceDay == NONE ? null : LocalDate.ofEpochDay(stateSinceDay);
    }

    /** The date of the last observation, or null before the first. */
    public LocalDate lastDate() {
        return lastDay == NONE ? null : LocalDate.ofEpochDay(lastDay);
    }

    public double lastValueBp() {
        return lastValueBp;
    }

    /** Average of the current quarter so far, to {@link Resolution#BASIS_POINTS}; NaN before the first observation. */
    public double quarterToDateAverageBp() {
        return Resolution.BASIS_POINTS.average(quarterUnits, quarterCount);
    }

    public int quarterToDateObservations() {
        return quarterCount;
    }

    /** Calendar days continuously below the entry threshold up to the last observation, 0 if not below. */
    public long daysInverted() {
        return invertedSinceDay == NONE ? 0 : (long) lastDay - invertedSinceDay;
    }

    /**
     * The first date of the run below the entry threshold that {@link #daysInverted()} counts from,
     * or null when the last observation is not below it. Within a spell it can be later than the
     * spell's start: a value between the entry and the exit threshold does not end a spell, but it
     * ends a run below the entry threshold.
     */
    public LocalDate invertedSince() {
        return invertedSinceDay == NONE ? null : LocalDate.ofEpochDay(invertedSinceDay);
    }

    /** The last spell that ended, or null if none has. */
    public Spell endedSpell() {
        return endedSpell;
    }

    /** Spells started so far. */
    public long spellCount() {
        return spellCount;
    }

    /** The spell in progress, or null. */
    public Spell openSpell() {
        return spellStartDay == NONE ? null : spell(lastDay, false);
    }

    Spell spell(int endDay, boolean ended) {
        return new Spell(spread, spellCount, LocalDate.ofEpochDay(spellStartDay),
                spellConfirmedDay == NONE ? null : LocalDate.ofEpochDay(spellConfirmedDay), spellConfirmedBy,
                ended ? LocalDate.ofEpochDay(endDay) : null, (long) endDay - spellStartDay, spellObservations,
                spellDeepestBp, LocalDate.ofEpochDay(spellDeepestDay), Resolution.BASIS_POINTS.value(spellAreaUnits));
    }

    /** An independent copy, e.g. a checkpoint to return to when a provisional value is replaced. */
    public MonitorState copy() {
        MonitorState c = new MonitorState(spread, windows);
        c.copyFrom(this);
        return c;
    }

    private MonitorState(SpreadKey spread, TrailingWindow[] template) {
        this.spread = spread;
        this.windows = new TrailingWindow[template.length];
        for (int i = 0; i < template.length; i++) {
            if (template[i] != null) {
                windows[i] = new TrailingWindow(template[i].windowDays());
            }
        }
    }

    /** Overwrites this state with another of the same spread and definition, reusing buffers. */
    public void copyFrom(MonitorState o) {
        if (!spread.equals(o.spread) || windows.length != o.windows.length) {
            throw new IllegalArgumentException("cannot copy the state of " + o.spread + " into " + spread);
        }
        state = o.state;
        stateSinceDay = o.stateSinceDay;
        firstDay = o.firstDay;
        lastDay = o.lastDay;
        lastValueBp = o.lastValueBp;
        monthIndex = o.monthIndex;
        monthFirstDay = o.monthFirstDay;
        quarterIndex = o.quarterIndex;
        quarterCounts = o.quarterCounts;
        quarterUnits = o.quarterUnits;
        quarterCount = o.quarterCount;
        invertedSinceDay = o.invertedSinceDay;
        aboveExitRun = o.aboveExitRun;
        resteepenedDay = o.resteepenedDay;
        spellCount = o.spellCount;
        spellStartDay = o.spellStartDay;
        spellConfirmedDay = o.spellConfirmedDay;
        spellConfirmedBy = o.spellConfirmedBy;
        spellObservations = o.spellObservations;
        spellDeepestBp = o.spellDeepestBp;
        spellDeepestDay = o.spellDeepestDay;
        spellAreaUnits = o.spellAreaUnits;
        spellLastDepthUnits = o.spellLastDepthUnits;
        endedSpell = o.endedSpell;
        for (int i = 0; i < windows.length; i++) {
            if (windows[i] != null) {
                windows[i].copyFrom(o.windows[i]);
            }
        }
    }

    @Override
    public String toString() {
        return spread + " " + state + " as of " + lastDate();
    }
}
