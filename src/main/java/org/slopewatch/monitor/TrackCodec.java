package org.slopewatch.monitor;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;
import java.time.LocalDate;
import java.util.List;
import org.slopewatch.spread.SpreadKey;

/**
 * A spread track's whole state as bytes and back, for checkpoints: the base, current and
 * provisional states, the observations, transitions and spells held, and a count kept for
 * earlier versions' checkpoints ({@link SpreadTrack#write}). Plain {@link DataOutput};
 * what the bytes mean is this class's alone, and a reader of another layout refuses them (the
 * caller then rebuilds from the journal).
 */
final class TrackCodec {

    private TrackCodec() {
    }

    static void writeState(MonitorState s, DataOutput out) throws IOException {
        out.writeByte(s.state.ordinal());
        out.writeInt(s.stateSinceDay);
        out.writeInt(s.firstDay);
        out.writeInt(s.lastDay);
        out.writeDouble(s.lastValueBp);
        out.writeInt(s.monthIndex);
        out.writeInt(s.monthFirstDay);
        out.writeInt(s.quarterIndex);
        out.writeBoolean(s.quarterCounts);
        out.writeLong(s.quarterUnits);
        out.writeInt(s.quarterCount);
        out.writeInt(s.invertedSinceDay);
        out.writeInt(s.aboveExitRun);
        out.writeInt(s.resteepenedDay);
        out.writeLong(s.spellCount);
        out.writeInt(s.spellStartDay);
        out.writeInt(s.spellConfirmedDay);
        writeText(s.spellConfirmedBy, out);
        out.writeInt(s.spellObservations);
        out.writeDouble(s.spellDeepestBp);
        out.writeInt(s.spellDeepestDay);
        out.writeLong(s.spellAreaUnits);
        out.writeLong(s.spellLastDepthUnits);
        out.writeBoolean(s.endedSpell != null);
        if (s.endedSpell != null) {
            writeSpell(s.endedSpell, out);
        }
        out.writeInt(s.windows.length);
        for (TrailingWindow w : s.windows) {
            out.writeBoolean(w != null);
            if (w != null) {
                w.writeTo(out);
            }
        }
    }

    /** Reads a state written by {@link #writeState} into {@code s}, a fresh state of the same spread and rules. */
    static void readState(MonitorState s, DataInput in) throws IOException {
        s.state = SpreadState.values()[in.readUnsignedByte()];
        s.stateSinceDay = in.readInt();
        s.firstDay = in.readInt();
        s.lastDay = in.readInt();
        s.lastValueBp = in.readDouble();
        s.monthIndex = in.readInt();
        s.monthFirstDay = in.readInt();
        s.quarterIndex = in.readInt();
        s.quarterCounts = in.readBoolean();
        s.quarterUnits = in.readLong();
        s.quarterCount = in.readInt();
        s.invertedSinceDay = in.readInt();
        s.aboveExitRun = in.readInt();
        s.resteepenedDay = in.readInt();
        s.spellCount = in.readLong();
        s.spellStartDay = in.readInt();
        s.spellConfirmedDay = in.readInt();
        s.spellConfirmedBy = readText(in);
        s.spellObservations = in.readInt();
        s.spellDeepestBp = in.readDouble();
        s.spellDeepestDay = in.readInt();
        s.spellAreaUnits = in.readLong();
        s.spellLastDepthUnits = in.readLong();
        s.endedSpell = in.readBoolean() ? readSpell(s.spread, in) : null;
        int windows = in.readInt();
        if (windows != s.windows.length) {
            throw new IOException("state of " + s.spread + " has " + windows + " trailing windows, the rules in force " + s.windows.length);
        }
        for (int i = 0; i < windows; i++) {
            boolean present = in.readBoolean();
            if (present != (s.windows[i] != null)) {
                throw new IOException("trailing window " + i + " of " + s.spread + " does not match the rules in force");
            }
            if (present) {
                s.windows[i].readFrom(in);
            }
        }
    }

    static void writeTransitions(List<Transition> transitions, DataOutput out) throws IOException {
        out.writeInt(transitions.size());
        for (Transition t : transitions) {
            out.writeLong(t.date().toEpochDay());
            out.writeByte(t.from().ordinal());
            out.writeByte(t.to().ordinal());
            writeText(t.reason(), out);
            Evidence e = t.evidence();
            writeText(e.test(), out);
            writeText(e.window(), out);
            out.writeDouble(e.measured());
            out.writeDouble(e.limit());
            out.writeDouble(e.valueBp());
            out.writeLong(e.daysInverted());
            out.writeLong(t.spellId());
            out.writeLong(t.sequence());
        }
    }

    static void readTransitions(SpreadKey spread, DataInput in, List<Transition> into) throws IOException {
        int n = count(in);
        for (int i = 0; i < n; i++) {
            LocalDate date = LocalDate.ofEpochDay(in.readLong());
            SpreadState from = SpreadState.values()[in.readUnsignedByte()];
            SpreadState to = SpreadState.values()[in.readUnsignedByte()];
            String reason = readText(in);
            Evidence e = new Evidence(readText(in), readText(in), in.readDouble(), in.readDouble(), in.readDouble(), in.readLong());
            into.add(new Transition(spread, date, from, to, reason, e, in.readLong(), in.readLong()));
        }
    }

    static void writeSpells(List<Spell> spells, DataOutput out) throws IOException {
        out.writeInt(spells.size());
        for (Spell s : spells) {
            writeSpell(s, out);
        }
    }

    static void readSpells(SpreadKey spread, DataInput in, List<Spell> into) throws IOException {
        int n = count(in);
        for (int i = 0; i < n; i++) {
            into.add(readSpell(spread, in));
        }
    }

    private static void writeSpell(Spell s, DataOutput out) throws IOException {
        out.writeLong(s.id());
        out.writeLong(s.start().toEpochDay());
        writeDate(s.confirmed(), out);
        writeText(s.confirmedBy(), out);
        writeDate(s.end(), out);
        out.writeLong(s.durationDays());
        out.writeInt(s.observations());
        out.writeDouble(s.deepestBp());
        out.writeLong(s.deepestDate().toEpochDay());
        out.writeDouble(s.invertedAreaBpDays());
    }

    private static Spell readSpell(SpreadKey spread, DataInput in) throws IOException {
        return new Spell(spread, in.readLong(), LocalDate.ofEpochDay(in.readLong()), readDate(in), readText(in), readDate(in),
                in.readLong(), in.readInt(), in.readDouble(), LocalDate.ofEpochDay(in.readLong()), in.readDouble());
    }

    private static void writeDate(LocalDate date, DataOutput out) throws IOException {
        out.writeLong(date == null ? Long.MIN_VALUE : date.toEpochDay());
    }

    private static LocalDate readDate(DataInput in) throws IOException {
        long day = in.readLong();
        return day == Long.MIN_VALUE ? null : LocalDate.ofEpochDay(day);
    }

    private static void writeText(String text, DataOutput out) throws IOException {
        out.writeBoolean(text != null);
        if (text != null) {
            out.writeUTF(text);
        }
    }

    private static String readText(DataInput in) throws IOException {
        return in.readBoolean() ? in.readUTF() : null;
    }

    /** A count read back, refused when negative or beyond what a checkpoint can hold (damaged bytes). */
    static int count(DataInput in) throws IOException {
        int n = in.readInt();
        if (n < 0 || n > 50_000_000) {
            throw new IOException("count out of range: " + n);
        }
        return n;
    }
}
