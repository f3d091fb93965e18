package org.slopewatch.curve;

import java.time.LocalDate;

/**
 * Where a {@link CurveBook} finds the snapshots it no longer holds in memory (the daemon's
 * journal): a quote for an old date merges into that date's snapshot as the quotes recorded so far
 * made it. Offline users keep every snapshot and never ask.
 */
public interface EarlierSnapshots {

    /**
     * The curve's snapshot on the latest date on or before {@code date} as the quotes recorded
     * before input {@code beforeSequence} made it, or null when there is none.
     */
    CurveSnapshot onOrBefore(String curve, LocalDate date, long beforeSequence);

    /** For books that never let a snapshot go. */
    EarlierSnapshots NONE = (curve, date, beforeSequence) -> {
        throw new IllegalStateException("snapshots of " + curve + " up to " + date + " were let go with nowhere to read them");
    };
}
