package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.List;
import org.slopewatch.spread.SpreadKey;

/**
 * Where a track finds the observations it no longer holds in memory (the daemon's journal), for a
 * revision dated before its window. Offline users keep every observation and never ask.
 */
@FunctionalInterface
public interface EarlierObservations {

    /**
     * The spread's standing value on each date up to and including {@code through}, oldest first,
     * as it stood just before input {@code beforeSequence} (the latest value of a date wins).
     */
    List<Observation> through(SpreadKey spread, LocalDate through, long beforeSequence);

    /** For engines that never let an observation go. */
    EarlierObservations NONE = (spread, through, beforeSequence) -> {
        throw new IllegalStateException("observations of " + spread + " up to " + through + " were let go with nowhere to read them");
    };
}
