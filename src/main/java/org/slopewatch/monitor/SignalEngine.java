package org.slopewatch.monitor;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
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

    public SignalEngine(List<Watch> watches) {
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
                track = new SpreadTrack(monitors.get(i), new SpreadKey(snapshot.curve(), w.spread().name()));
                curveTracks[i] = track;
                tracks.add(track);
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

    /** Tracks in the order their spreads were first seen. */
    public List<SpreadTrack> tracks() {
        return Collections.unmodifiableList(tracks);
    }
}
