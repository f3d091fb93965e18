package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.slopewatch.spread.SpreadKey;

/**
 * One spread's monitor with its history, so that values can change after the fact.
 *
 * <p>A value for a new date is simply observed. A second value for the latest date replaces the
 * provisional one: the state returns to its checkpoint from before that date and the new value is
 * observed instead. A value for an earlier date is a revision: the whole history is re-run and,
 * if the transitions from that date on come out differently, a {@link Revision} says so. Nothing
 * changes silently.
 */
public final class SpreadTrack {

    private final InversionMonitor monitor;
    private final SpreadKey spread;
    private MonitorState state;
    private MonitorState checkpoint;
    private int[] days = new int[64];
    private double[] values = new double[64];
    private long[] sequences = new long[64];
    private int size;
    private final List<Transition> transitions = new ArrayList<>();
    private final List<Spell> spells = new ArrayList<>();

    public SpreadTrack(InversionMonitor monitor, SpreadKey spread) {
        this.monitor = monitor;
        this.spread = spread;
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

    /** Every transition so far, as things stand after any revisions. */
    public List<Transition> transitions() {
        return List.copyOf(transitions);
    }

    /** Every ended spell so far, as things stand after any revisions. */
    public List<Spell> endedSpells() {
        return List.copyOf(spells);
    }

    /** Observations held, oldest first. */
    public int size() {
        return size;
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
        return revise(o, at);
    }

    private List<MonitorEvent> replaceLatest(Observation o) {
        List<Transition> before = transitionsFrom(o.date());
        transitions.removeAll(before);
        spells.removeIf(s -> !s.end().isBefore(o.date()));
        state.copyFrom(checkpoint);
        values[size - 1] = o.valueBp();
        sequences[size - 1] = o.sequence();
        List<MonitorEvent> events = keep(monitor.observe(state, o));
        return withRevision(events, o, before);
    }

    private List<MonitorEvent> revise(Observation o, int at) {
        int day = (int) o.date().toEpochDay();
        if (at >= 0) {
            values[at] = o.valueBp();
            sequences[at] = o.sequence();
        } else {
            insert(-at - 1, day, o.valueBp(), o.sequence());
        }
        List<Transition> before = transitionsFrom(o.date());
        transitions.clear();
        spells.clear();
        state = monitor.newState(spread);
        for (int i = 0; i < size; i++) {
            if (i == size - 1) {
                checkpoint.copyFrom(state);
            }
            Observation replayed = new Observation(LocalDate.ofEpochDay(days[i]), values[i], sequences[i]);
            keep(monitor.observe(state, replayed));
        }
        return withRevision(List.of(), o, before);
    }

    /**
     * The events of a replacement or revision. A replacement that brings transitions where there
     * were none reports them as they come. Otherwise transitions and spells already reported are
     * not reported again: with the same outcomes they stand as reported, and with other outcomes
     * (also when a late quote makes transitions where there were none) a revision carries the new
     * ones and the spells as they now stand. Reporting them twice journalled a transition twice
     * and clashed on a spell's key.
     */
    private List<MonitorEvent> withRevision(List<MonitorEvent> events, Observation o, List<Transition> before) {
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
        if (!sameOutcomes(before, after)) {
            out.add(new Revision(spread, o.date(), before, after, o.sequence()));
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
        List<Transition> out = new ArrayList<>();
        for (Transition t : transitions) {
            if (!t.date().isBefore(date)) {
                out.add(t);
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
