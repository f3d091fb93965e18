package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import org.slopewatch.spread.SpreadKey;

/**
 * One spread's monitor with its history, so that values can change after the fact.
 *
 * <p>A value for a new date is simply observed. A second value for the latest date replaces the
 * provisional one: the state returns to its checkpoint from before that date and the new value is
 * observed instead. A value for an earlier date is a revision: the whole history is re-run and,
 * if the transitions from that date on come out differently, a {@link Revision} says so. Nothing
 * changes silently.
 *
 * <p>Memory can be bounded ({@link #letGoBefore(int)}): observations older than a window of
 * calendar days are folded into a base state (the state after all of them), so a revision inside
 * the window re-runs from the base, and one dated before it reads the spread's earlier values from
 * {@link EarlierObservations} and re-runs the whole history (slower, as correct). Transitions and
 * ended spells dated on or before the base's last day are let go of with the observations, so what
 * a track holds does not grow with the length of its history: a revision inside the window changes
 * only what is dated after the base, and one before it re-runs the values read back twice, without
 * and with the revised value, which gives the transitions and spells as they stood (a track holds
 * exactly what a re-run of its observations gives, so nothing needs reading but the values).
 *
 * <p>A re-run whose transitions come out the same reports no revision, yet a revised value
 * inside an ended spell may change that spell's figures (deepest value, area, observations): a
 * {@link SpellRestatement} then carries the spells as they now stand, so that what was written of
 * them is written over at once.
 */
public final class SpreadTrack {

    private final InversionMonitor monitor;
    private final SpreadKey spread;
    private final EarlierObservations earlier;
    /** The state after every observation let go of (all dated on or before its last day); fresh when none was. */
    private MonitorState base;
    private long baseCount;
    private MonitorState state;
    private MonitorState checkpoint;
    private int[] days = new int[64];
    private double[] values = new double[64];
    private long[] sequences = new long[64];
    private int size;
    private final List<Transition> transitions = new ArrayList<>();
    private final List<Spell> spells = new ArrayList<>();

    public SpreadTrack(InversionMonitor monitor, SpreadKey spread) {
        this(monitor, spread, EarlierObservations.NONE);
    }

    /** @param earlier where the observations let go of are read back from for a revision dated before the window */
    public SpreadTrack(InversionMonitor monitor, SpreadKey spread, EarlierObservations earlier) {
        this.monitor = monitor;
        this.spread = spread;
        this.earlier = earlier;
        this.base = monitor.newState(spread);
        this.state = monitor.newState(spread);
        this.checkpoint = monitor.newState(spread);
    }

    public SpreadKey spread() {
        return spread;
    }

    /** The rules this spread is monitored by. */
    public MonitorDefinition rules() {
        return monitor.definition();
    }

    /** The current state (read-only use). */
    public MonitorState state() {
        return state;
    }

    /**
     * The transitions held, as things stand after any revisions: every one dated after the base's
     * last day (every one so far when nothing was let go of).
     */
    public List<Transition> transitions() {
        return List.copyOf(transitions);
    }

    /**
     * The ended spells held, as things stand after any revisions: every one that ended after the
     * base's last day (every one so far when nothing was let go of).
     */
    public List<Spell> endedSpells() {
        return List.copyOf(spells);
    }

    /** Observations held in memory, oldest first: the window (every observation when none was let go of). */
    public int size() {
        return size;
    }

    /** Dates observed in all, held or let go of. */
    public long observations() {
        return baseCount + size;
    }

    public LocalDate date(int index) {
        return LocalDate.ofEpochDay(days[index]);
    }

    public double valueBp(int index) {
        return values[index];
    }

    /** Records a value for a date: new, a replacement of the latest date's value, or a revision. */
    public List<MonitorEvent> record(Observation o) {
        int day = (int) o.date().toEpochDay();
        if (size == 0 || day > days[size - 1]) {
            checkpoint.copyFrom(state);
            append(day, o.valueBp(), o.sequence());
            return keep(monitor.observe(state, o));
        }
        int at = Arrays.binarySearch(days, 0, size, day);
        if (at >= 0 && values[at] == o.valueBp()) {
            return List.of(); // the same value again changes nothing
        }
        if (at == size - 1) {
            return replaceLatest(o);
        }
        if (base.lastDay != MonitorState.NONE && day <= base.lastDay) {
            return reviseFromEarlier(o);
        }
        return revise(o, at);
    }

    private List<MonitorEvent> replaceLatest(Observation o) {
        List<Transition> before = transitionsFrom(o.date());
        List<Spell> beforeSpells = spellsFrom(o.date());
        transitions.removeAll(before);
        spells.removeAll(beforeSpells);
        state.copyFrom(checkpoint);
        values[size - 1] = o.valueBp();
        sequences[size - 1] = o.sequence();
        List<MonitorEvent> events = keep(monitor.observe(state, o));
        return withRevision(events, o, before, beforeSpells);
    }

    private List<MonitorEvent> revise(Observation o, int at) {
        int day = (int) o.date().toEpochDay();
        if (at >= 0) {
            values[at] = o.valueBp();
            sequences[at] = o.sequence();
        } else {
            insert(-at - 1, day, o.valueBp(), o.sequence());
        }
        // dated after the base: what it can change is held
        return rerunFromBase(o, transitionsFrom(o.date()), spellsFrom(o.date()));
    }

    /**
     * A revision dated on or before the base's last day: the values let go of are read back, the
     * revised one put among them, and everything is held again and re-run from a fresh state (the
     * next {@link #letGoBefore(int)} bounds memory again). What stood from the revised date on
     * before it, some of it let go of, is worked out by a re-run of the values as they were: a track
     * holds what a re-run of its observations gives, so this is what one holding everything holds.
     */
    private List<MonitorEvent> reviseFromEarlier(Observation o) {
        List<Observation> older = earlier.through(spread, LocalDate.ofEpochDay(base.lastDay), o.sequence());
        int day = (int) o.date().toEpochDay();
        int n = older.size();
        int[] d = new int[n + size + 1];
        double[] v = new double[n + size + 1];
        long[] q = new long[n + size + 1];
        int k = 0;
        boolean placed = false;
        for (Observation e : older) {
            int eDay = (int) e.date().toEpochDay();
            if (!placed && eDay >= day) {
                if (eDay == day && e.valueBp() == o.valueBp()) {
                    return List.of(); // the same value again changes nothing
                }
                d[k] = day;
                v[k] = o.valueBp();
                q[k++] = o.sequence();
                placed = true;
                if (eDay == day) {
                    continue;
                }
            }
            d[k] = eDay;
            v[k] = e.valueBp();
            q[k++] = e.sequence();
        }
        if (!placed) {
            d[k] = day;
            v[k] = o.valueBp();
            q[k++] = o.sequence();
        }
        List<Transition> stood = new ArrayList<>();
        List<Spell> stoodSpells = new ArrayList<>();
        MonitorState asItWas = monitor.newState(spread);
        for (Observation e : older) {
            collect(monitor.observe(asItWas, e), stood, stoodSpells);
        }
        for (int i = 0; i < size; i++) {
            collect(monitor.observe(asItWas, observation(i)), stood, stoodSpells);
        }
        List<Transition> before = onOrAfter(stood, Transition::date, o.date());
        List<Spell> beforeSpells = onOrAfter(stoodSpells, Spell::end, o.date());
        System.arraycopy(days, 0, d, k, size);
        System.arraycopy(values, 0, v, k, size);
        System.arraycopy(sequences, 0, q, k, size);
        days = d;
        values = v;
        sequences = q;
        size = k + size;
        base = monitor.newState(spread);
        baseCount = 0;
        return rerunFromBase(o, before, beforeSpells);
    }

    /** The transitions and ended spells among {@code events}, added to the lists. */
    private static void collect(List<MonitorEvent> events, List<Transition> transitions, List<Spell> spells) {
        for (MonitorEvent e : events) {
            if (e instanceof Transition t) {
                transitions.add(t);
            } else if (e instanceof Spell s) {
                spells.add(s);
            }
        }
    }

    /**
     * Re-runs the held observations from the base: transitions and spells after the base's last day
     * are worked out again; {@code before} and {@code beforeSpells} are those from the revised date
     * on as they stood.
     */
    private List<MonitorEvent> rerunFromBase(Observation o, List<Transition> before, List<Spell> beforeSpells) {
        int baseDay = base.lastDay;
        transitions.removeIf(t -> t.date().toEpochDay() > baseDay);
        spells.removeIf(s -> s.end().toEpochDay() > baseDay);
        state = base.copy();
        for (int i = 0; i < size; i++) {
            if (i == size - 1) {
                checkpoint.copyFrom(state);
            }
            keep(monitor.observe(state, observation(i)));
        }
        return withRevision(List.of(), o, before, beforeSpells);
    }

    private Observation observation(int index) {
        return new Observation(LocalDate.ofEpochDay(days[index]), values[index], sequences[index]);
    }

    /**
     * Lets go of the observations dated {@code windowDays} or more calendar days before the latest
     * (the latest is always held), folding them into the base state. Works in runs of at least
     * {@link #LET_GO_RUN} observations, so a call per step costs nothing most of the time; memory
     * holds at most the window and one run.
     */
    public void letGoBefore(int windowDays) {
        if (size <= LET_GO_RUN) {
            return;
        }
        int cutoff = days[size - 1] - windowDays; // dates at or before it are outside the window
        if (days[LET_GO_RUN - 1] > cutoff) {
            return;
        }
        int n = LET_GO_RUN;
        while (n < size - 1 && days[n] <= cutoff) {
            n++;
        }
        for (int i = 0; i < n; i++) {
            // what these observations caused was kept when they first came: the base only needs their effect on the state
            monitor.observe(base, observation(i));
        }
        baseCount += n;
        size -= n;
        // what they caused was reported, and a revision dated on or before the base's last day works it out again
        int baseDay = base.lastDay;
        transitions.removeIf(t -> t.date().toEpochDay() <= baseDay);
        spells.removeIf(s -> s.end().toEpochDay() <= baseDay);
        int capacity = days.length > 4 * Math.max(size, 64) ? Math.max(64, 2 * size) : days.length;
        days = shift(days, n, capacity);
        values = shift(values, n, capacity);
        sequences = shift(sequences, n, capacity);
    }

    /** Observations let go of in one run at least: small enough to keep memory near the window, large enough to amortise the shift. */
    static final int LET_GO_RUN = 64;

    private int[] shift(int[] a, int from, int capacity) {
        int[] to = capacity == a.length ? a : new int[capacity];
        System.arraycopy(a, from, to, 0, size);
        return to;
    }

    private double[] shift(double[] a, int from, int capacity) {
        double[] to = capacity == a.length ? a : new double[capacity];
        System.arraycopy(a, from, to, 0, size);
        return to;
    }

    private long[] shift(long[] a, int from, int capacity) {
        long[] to = capacity == a.length ? a : new long[capacity];
        System.arraycopy(a, from, to, 0, size);
        return to;
    }

    /**
     * The events of a replacement or revision. A replacement that brings transitions where there
     * were none reports them as they come. Otherwise transitions and spells already reported are
     * not reported again: with the same outcomes they stand as reported, and with other outcomes
     * (also when a late quote makes transitions where there were none) a revision carries the new
     * ones and the spells as they now stand. Reporting them twice journalled a transition twice
     * and clashed on a spell's key.
     *
     * <p>With the same transitions the same spells ended on the same dates (under the same ids),
     * but a revised value inside one changes its figures: a {@link SpellRestatement} carries those
     * that changed.
     */
    private List<MonitorEvent> withRevision(List<MonitorEvent> events, Observation o, List<Transition> before, List<Spell> beforeSpells) {
        List<Transition> after = transitionsFrom(o.date());
        if (before.isEmpty() && events.containsAll(after)) {
            return events;
        }
        List<MonitorEvent> out = new ArrayList<>(events.size() + 1);
        for (MonitorEvent e : events) {
            if (!(e instanceof Transition) && !(e instanceof Spell)) {
                out.add(e);
            }
        }
        List<Spell> now = spellsFrom(o.date());
        if (!sameOutcomes(before, after)) {
            out.add(new Revision(spread, o.date(), before, after, now, o.sequence()));
        } else {
            List<Spell> changed = new ArrayList<>();
            for (Spell s : now) {
                if (!beforeSpells.contains(s)) {
                    changed.add(s);
                }
            }
            if (!changed.isEmpty()) {
                out.add(new SpellRestatement(spread, o.date(), changed, o.sequence()));
            }
        }
        return out;
    }

    private static boolean sameOutcomes(List<Transition> a, List<Transition> b) {
        if (a.size() != b.size()) {
            return false;
        }
        for (int i = 0; i < a.size(); i++) {
            if (!a.get(i).sameOutcome(b.get(i))) {
                return false;
            }
        }
        return true;
    }

    private List<Transition> transitionsFrom(LocalDate date) {
        return onOrAfter(transitions, Transition::date, date);
    }

    private List<Spell> spellsFrom(LocalDate date) {
        return onOrAfter(spells, Spell::end, date);
    }

    private static <T> List<T> onOrAfter(List<T> items, Function<T, LocalDate> dated, LocalDate date) {
        List<T> out = new ArrayList<>();
        for (T item : items) {
            if (!dated.apply(item).isBefore(date)) {
                out.add(item);
            }
        }
        return out;
    }

    private List<MonitorEvent> keep(List<MonitorEvent> events) {
        for (MonitorEvent e : events) {
            if (e instanceof Transition t) {
                transitions.add(t);
            } else if (e instanceof Spell s) {
                spells.add(s);
            }
        }
        return events;
    }

    /** Writes everything this track holds (checkpoints); {@link #read} gives an equal track back. */
    public void write(java.io.DataOutput out) throws java.io.IOException {
        TrackCodec.writeState(base, out);
        out.writeLong(baseCount);
        TrackCodec.writeState(state, out);
        TrackCodec.writeState(checkpoint, out);
        out.writeInt(size);
        for (int i = 0; i < size; i++) {
            out.writeInt(days[i]);
            out.writeDouble(values[i]);
            out.writeLong(sequences[i]);
        }
        TrackCodec.writeTransitions(transitions, out);
        TrackCodec.writeSpells(spells, out);
        // the ids of spells held back until a revision, which earlier versions kept: none since a
        // restatement writes them at once, but the count stays so that their checkpoints still read
        // (a new layout would make every curve of a journal replay all its quotes at the first start)
        out.writeInt(0);
    }

    /**
     * A track as {@link #write} wrote it, under the given rules.
     *
     * @throws java.io.IOException when the bytes are not such a track for these rules (damaged, or another layout)
     */
    public static SpreadTrack read(InversionMonitor monitor, SpreadKey spread, EarlierObservations earlier, java.io.DataInput in)
            throws java.io.IOException {
        SpreadTrack t = new SpreadTrack(monitor, spread, earlier);
        TrackCodec.readState(t.base, in);
        t.baseCount = in.readLong();
        TrackCodec.readState(t.state, in);
        TrackCodec.readState(t.checkpoint, in);
        int n = TrackCodec.count(in);
        t.days = new int[Math.max(64, n)];
        t.values = new double[Math.max(64, n)];
        t.sequences = new long[Math.max(64, n)];
        for (int i = 0; i < n; i++) {
            t.days[i] = in.readInt();
            t.values[i] = in.readDouble();
            t.sequences[i] = in.readLong();
            if (i > 0 && t.days[i] <= t.days[i - 1]) {
                throw new java.io.IOException("observations of " + spread + " out of date order");
            }
        }
        t.size = n;
        TrackCodec.readTransitions(spread, in, t.transitions);
        TrackCodec.readSpells(spread, in, t.spells);
        int heldBack = TrackCodec.count(in);
        for (int i = 0; i < heldBack; i++) {
            in.readLong(); // an earlier version's spell held back: its row stays as that version wrote it
        }
        return t;
    }

    private void append(int day, double value, long sequence) {
        ensureCapacity();
        days[size] = day;
        values[size] = value;
        sequences[size] = sequence;
        size++;
    }

    private void insert(int index, int day, double value, long sequence) {
        ensureCapacity();
        System.arraycopy(days, index, days, index + 1, size - index);
        System.arraycopy(values, index, values, index + 1, size - index);
        System.arraycopy(sequences, index, sequences, index + 1, size - index);
        days[index] = day;
        values[index] = value;
        sequences[index] = sequence;
        size++;
    }

    private void ensureCapacity() {
        if (size == days.length) {
            days = Arrays.copyOf(days, size * 2);
            values = Arrays.copyOf(values, size * 2);
            sequences = Arrays.copyOf(sequences, size * 2);
        }
    }
}
