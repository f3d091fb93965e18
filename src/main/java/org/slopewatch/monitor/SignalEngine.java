package org.slopewatch.monitor;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.spread.SpreadKey;

/**
 * Curve snapshots in, monitor events out: computes every watched spread of the snapshot's curve
 * and feeds its track. The replay command and the daemon both drive this object.
 *
 * <p>Not thread-safe: one engine serves one ordered stream (the daemon keeps one per partition
 * of curves).
 */
public final class SignalEngine {

    private final List<Watch> watches;
    private final List<InversionMonitor> monitors;
    private final Map<String, SpreadTrack[]> tracksByCurve = new HashMap<>();
    private final List<SpreadTrack> tracks = new ArrayList<>();
    /**
     * When each track was first seen: the input's sequence number and the watch's place, so that the
     * order is the journal's whether a track was rebuilt from quotes or read from a checkpoint.
     */
    private final Map<SpreadTrack, Long> firstSeen = new IdentityHashMap<>();
    private final EarlierObservations earlier;

    public SignalEngine(List<Watch> watches) {
        this(watches, EarlierObservations.NONE);
    }

    /** @param earlier where tracks read the observations they let go of ({@link #letGoBefore}) */
    public SignalEngine(List<Watch> watches, EarlierObservations earlier) {
        this.earlier = earlier;
        if (watches.isEmpty()) {
            throw new IllegalArgumentException("nothing to watch: configure at least one spread");
        }
        this.watches = List.copyOf(watches);
        this.monitors = new ArrayList<>(watches.size());
        for (Watch w : watches) {
            monitors.add(new InversionMonitor(w.rules()));
        }
    }

    public List<Watch> watches() {
        return watches;
    }

    /**
     * Computes the watched spreads on a snapshot and records them. A snapshot for a date already
     * seen replaces that date's values (and may report a revision).
     *
     * @param sequence the input sequence number carried into transitions
     */
    public List<MonitorEvent> onSnapshot(CurveSnapshot snapshot, long sequence) {
        return onSnapshot(snapshot, sequence, NO_LISTENER);
    }

    /** Hears every spread value computed, e.g. to journal it. */
    @FunctionalInterface
    public interface ObservationListener {
        void observed(SpreadKey spread, Observation observation);
    }

    private static final ObservationListener NO_LISTENER = (spread, observation) -> { };

    /** As {@link #onSnapshot(CurveSnapshot, long)}, telling {@code listener} each spread value computed. */
    public List<MonitorEvent> onSnapshot(CurveSnapshot snapshot, long sequence, ObservationListener listener) {
        List<MonitorEvent> events = List.of();
        SpreadTrack[] curveTracks = tracksByCurve.computeIfAbsent(snapshot.curve(), c -> new SpreadTrack[watches.size()]);
        for (int i = 0; i < watches.size(); i++) {
            Watch w = watches.get(i);
            if (!w.appliesTo(snapshot.curve())) {
                continue;
            }
            double value = w.spread().valueBp(snapshot);
            if (Double.isNaN(value)) {
                continue;
            }
            SpreadTrack track = curveTracks[i];
            if (track == null) {
                track = new SpreadTrack(monitors.get(i), new SpreadKey(snapshot.curve(), w.spread().name()), earlier);
                curveTracks[i] = track;
                tracks.add(track);
                firstSeen.put(track, sequence * watches.size() + i);
            }
            Observation observation = new Observation(snapshot.date(), value, sequence);
            listener.observed(track.spread(), observation);
            List<MonitorEvent> step = track.record(observation);
            if (!step.isEmpty()) {
                if (events.isEmpty()) {
                    events = new ArrayList<>(step);
                } else {
                    events.addAll(step);
                }
            }
        }
        return events;
    }

    /** The track of a spread, or null before its first value. */
    public SpreadTrack track(SpreadKey key) {
        SpreadTrack[] curveTracks = tracksByCurve.get(key.curve());
        if (curveTracks != null) {
            for (SpreadTrack t : curveTracks) {
                if (t != null && t.spread().equals(key)) {
                    return t;
                }
            }
        }
        return null;
    }

    /** Lets each track of a curve go of the observations before a window of calendar days ({@link SpreadTrack#letGoBefore}). */
    public void letGoBefore(String curve, int windowDays) {
        SpreadTrack[] curveTracks = tracksByCurve.get(curve);
        if (curveTracks != null) {
            for (SpreadTrack t : curveTracks) {
                if (t != null) {
                    t.letGoBefore(windowDays);
                }
            }
        }
    }

    /** Writes the tracks of one curve (a checkpoint); {@link #readCurve} puts them back into an engine of the same watches. */
    public void writeCurve(String curve, DataOutput out) throws IOException {
        SpreadTrack[] curveTracks = tracksByCurve.getOrDefault(curve, new SpreadTrack[watches.size()]);
        out.writeInt(curveTracks.length);
        for (SpreadTrack t : curveTracks) {
            out.writeBoolean(t != null);
            if (t != null) {
                out.writeUTF(t.spread().spread());
                out.writeLong(firstSeen.get(t));
                t.write(out);
            }
        }
    }

    /**
     * Reads one curve's tracks written by {@link #writeCurve} under the same watches, replacing any
     * held. Nothing is changed when the bytes do not fit these watches. Call {@link #orderByFirstSeen}
     * after the last curve.
     *
     * @throws IOException when they do not (damaged, or written under other watches)
     */
    public void readCurve(String curve, DataInput in) throws IOException {
        int n = in.readInt();
        if (n != watches.size()) {
            throw new IOException("tracks of " + curve + " written for " + n + " watches, " + watches.size() + " in force");
        }
        SpreadTrack[] read = new SpreadTrack[n];
        long[] order = new long[n];
        for (int i = 0; i < n; i++) {
            if (!in.readBoolean()) {
                continue;
            }
            String name = in.readUTF();
            if (!name.equals(watches.get(i).spread().name()) || !watches.get(i).appliesTo(curve)) {
                throw new IOException("track " + curve + ":" + name + " does not match the watch in force");
            }
            order[i] = in.readLong();
            read[i] = SpreadTrack.read(monitors.get(i), new SpreadKey(curve, name), earlier, in);
        }
        forget(curve);
        tracksByCurve.put(curve, read);
        for (int i = 0; i < n; i++) {
            if (read[i] != null) {
                tracks.add(read[i]);
                firstSeen.put(read[i], order[i]);
            }
        }
    }

    /** Drops every track of a curve (before it is rebuilt). */
    public void forget(String curve) {
        SpreadTrack[] held = tracksByCurve.remove(curve);
        if (held != null) {
            for (SpreadTrack t : held) {
                if (t != null) {
                    tracks.remove(t);
                    firstSeen.remove(t);
                }
            }
        }
    }

    /** After {@link #readCurve} calls: puts the tracks back in the order their spreads were first seen. */
    public void orderByFirstSeen() {
        tracks.sort(Comparator.comparingLong(firstSeen::get));
    }

    /** Tracks in the order their spreads were first seen. */
    public List<SpreadTrack> tracks() {
        return Collections.unmodifiableList(tracks);
    }
}
