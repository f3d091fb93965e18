package org.slopewatch.curve;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;
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
 * date's snapshot rather than the latest one. Memory can be bounded ({@link #letGoBefore}): the
 * snapshots before a window of calendar days are let go of, and one asked for later is read from
 * {@link EarlierSnapshots}. Not thread-safe: one writer.
 */
public final class CurveBook {

    private final Map<String, NavigableMap<LocalDate, CurveSnapshot>> curves = new HashMap<>();
    /** Per curve, the last date whose snapshot was let go of: at or before it, memory is not the whole story. */
    private final Map<String, LocalDate> letGoThrough = new HashMap<>();
    private final EarlierSnapshots earlier;

    public CurveBook() {
        this(EarlierSnapshots.NONE);
    }

    public CurveBook(EarlierSnapshots earlier) {
        this.earlier = earlier;
    }

    /** Merges quotes (tenor to yield in bp) into the snapshot of a curve and date and returns it. */
    public CurveSnapshot apply(String curve, LocalDate date, Map<Tenor, Double> yieldsBp) {
        return apply(curve, date, yieldsBp, Long.MAX_VALUE);
    }

    /**
     * As {@link #apply(String, LocalDate, Map)} for input {@code sequence}: a date let go of is
     * read back as the inputs before it left it.
     */
    public CurveSnapshot apply(String curve, LocalDate date, Map<Tenor, Double> yieldsBp, long sequence) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.computeIfAbsent(curve, c -> new TreeMap<>());
        CurveSnapshot snapshot = byDate.get(date);
        if (snapshot == null && isLetGo(curve, date)) {
            CurveSnapshot held = earlier.onOrBefore(curve, date, sequence);
            snapshot = held != null && held.date().equals(date) ? held : null;
        }
        snapshot = merged(snapshot, curve, date, yieldsBp);
        byDate.put(date, snapshot);
        return snapshot;
    }

    /** A quote merged into its date's snapshot (null: none yet): a later quote of a tenor replaces the earlier one. */
    public static CurveSnapshot merged(CurveSnapshot held, String curve, LocalDate date, Map<Tenor, Double> yieldsBp) {
        if (held == null) {
            return CurveSnapshot.of(curve, date, yieldsBp);
        }
        CurveSnapshot snapshot = held;
        for (Map.Entry<Tenor, Double> e : yieldsBp.entrySet()) {
            snapshot = snapshot.with(e.getKey(), e.getValue());
        }
        return snapshot;
    }

    private boolean isLetGo(String curve, LocalDate date) {
        LocalDate through = letGoThrough.get(curve);
        return through != null && !date.isAfter(through);
    }

    /**
     * Lets go of a curve's snapshots dated {@code windowDays} or more calendar days before its
     * latest (the latest is always held).
     */
    public void letGoBefore(String curve, int windowDays) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.get(curve);
        if (byDate == null || byDate.size() < 2) {
            return;
        }
        LocalDate cutoff = byDate.lastKey().minusDays(windowDays);
        if (byDate.firstKey().isAfter(cutoff)) {
            return;
        }
        NavigableMap<LocalDate, CurveSnapshot> outside = byDate.headMap(cutoff, true);
        LocalDate last = outside.lastKey();
        outside.clear();
        letGoThrough.merge(curve, last, (a, b) -> a.isAfter(b) ? a : b);
    }

    /** The snapshot of the latest date of each curve. */
    public Collection<CurveSnapshot> latest() {
        return curves.values().stream().filter(m -> !m.isEmpty()).map(m -> m.lastEntry().getValue()).toList();
    }

    /** The snapshot of a curve on a date, or null. */
    public CurveSnapshot snapshot(String curve, LocalDate date) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.get(curve);
        CurveSnapshot held = byDate == null ? null : byDate.get(date);
        if (held == null && isLetGo(curve, date)) {
            CurveSnapshot read = earlier.onOrBefore(curve, date, Long.MAX_VALUE);
            return read != null && read.date().equals(date) ? read : null;
        }
        return held;
    }

    /** The snapshot of a curve on the latest market date on or before {@code date}, or null. */
    public CurveSnapshot snapshotOnOrBefore(String curve, LocalDate date) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.get(curve);
        Map.Entry<LocalDate, CurveSnapshot> e = byDate == null ? null : byDate.floorEntry(date);
        if (e == null && letGoThrough.containsKey(curve)) {
            // every date held is after every date let go of, so only with none held on or before it can the answer lie there
            return earlier.onOrBefore(curve, date, Long.MAX_VALUE);
        }
        return e == null ? null : e.getValue();
    }

    /** Snapshots of a curve held in memory. */
    public int held(String curve) {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.get(curve);
        return byDate == null ? 0 : byDate.size();
    }

    /** Drops everything held of a curve (a checkpoint that could not be read in whole). */
    public void forget(String curve) {
        curves.remove(curve);
        letGoThrough.remove(curve);
    }

    /** Writes one curve's snapshots and what was let go of (a checkpoint); {@link #readCurve} puts them back. */
    public void writeCurve(String curve, DataOutput out) throws IOException {
        NavigableMap<LocalDate, CurveSnapshot> byDate = curves.getOrDefault(curve, new TreeMap<>());
        LocalDate through = letGoThrough.get(curve);
        out.writeLong(through == null ? Long.MIN_VALUE : through.toEpochDay());
        out.writeInt(byDate.size());
        for (CurveSnapshot s : byDate.values()) {
            out.writeLong(s.date().toEpochDay());
            out.writeInt(s.size());
            for (int i = 0; i < s.size(); i++) {
                out.writeUTF(s.tenor(i).toString());
                out.writeDouble(s.yieldBp(i));
            }
        }
    }

    /**
     * Reads what {@link #writeCurve} wrote, replacing the curve's snapshots.
     *
     * @throws IOException when the bytes are not such a curve (damaged, or another layout)
     */
    public void readCurve(String curve, DataInput in) throws IOException {
        long through = in.readLong();
        int n = in.readInt();
        if (n < 0) {
            throw new IOException("snapshot count out of range: " + n);
        }
        NavigableMap<LocalDate, CurveSnapshot> byDate = new TreeMap<>();
        // one Tenor per spelling, as the journal's reader shares them: a curve's snapshots repeat the same dozen
        Map<String, Tenor> tenorsRead = new HashMap<>();
        for (int i = 0; i < n; i++) {
            LocalDate date = LocalDate.ofEpochDay(in.readLong());
            int size = in.readInt();
            if (size < 0 || size > 1_000) {
                throw new IOException("tenor count out of range: " + size);
            }
            Tenor[] tenors = new Tenor[size];
            double[] yields = new double[size];
            for (int j = 0; j < size; j++) {
                String text = in.readUTF();
                try {
                    tenors[j] = tenorsRead.computeIfAbsent(text, Tenor::parse);
                } catch (IllegalArgumentException e) {
                    throw new IOException("not a tenor", e);
                }
                yields[j] = in.readDouble();
            }
            try {
                byDate.put(date, CurveSnapshot.ofSorted(curve, date, tenors, yields));
            } catch (IllegalArgumentException e) {
                throw new IOException("snapshot of " + curve + " on " + date + " unreadable", e);
            }
        }
        curves.put(curve, byDate);
        if (through == Long.MIN_VALUE) {
            letGoThrough.remove(curve);
        } else {
            letGoThrough.put(curve, LocalDate.ofEpochDay(through));
        }
    }
}
