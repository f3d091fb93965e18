package org.slopewatch.curve;

import java.time.LocalDate;
import java.util.Collection;
import java.util.HashMap;
import java.util.Map;
import java.util.NavigableMap;
import java.util.TreeMap;

/**
 * The latest known yields of every curve on every market date: quotes merge into the snapshot
 * of their curve and date, a later quote for the same tenor replacing the earlier one.
 *
 * <p>History is kept per date so that a quote for an earlier date (a revision) updates that
 * date's snapshot rather than the latest one. Not thread-safe: one writer.
 */
public final class CurveBook {

    private final Map<String, NavigableMap<LocalDate, CurveSnapshot>> curves = new HashMap<>();

    /** Merges quotes (tenor to yield in bp) into the snapshot of a curve and date and returns it. */
    public CurveSnapshot apply(String curve, LocalDate date, Map<Tenor, Double> yieldsBp) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.computeIfAbsent(curve, c -> new TreeMap<>());
        CurveSnapshot snapshot = byDate.get(date);
        if (snapshot == null) {
            snapshot = CurveSnapshot.of(curve, date, yieldsBp);
        } else {
            for (Map.Entry<Tenor, Double> e : yieldsBp.entrySet()) {
                snapshot = snapshot.with(e.getKey(), e.getValue());
            }
        }
        byDate.put(date, snapshot);
        return snapshot;
    }

    /** The snapshot of the latest date of each curve. */
    public Collection<CurveSnapshot> latest() {
        return curves.values().stream().map(m -> m.lastEntry().getValue()).toList();
    }

    /** The snapshot of a curve on a date, or null. */
    public CurveSnapshot snapshot(String curve, LocalDate date) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.get(curve);
        return byDate == null ? null : byDate.get(date);
    }

    /** The snapshot of a curve on the latest market date on or before {@code date}, or null. */
    public CurveSnapshot snapshotOnOrBefore(String curve, LocalDate date) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.get(curve);
        Map.Entry<LocalDate, CurveSnapshot> e = byDate == null ? null : byDate.floorEntry(date);
        return e == null ? null : e.getValue();
    }
}
