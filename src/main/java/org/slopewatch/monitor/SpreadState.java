package org.slopewatch.monitor;

/**
 * Where a spread stands. The numeric {@link #code()} is what metrics and dashboards plot; it
 * orders the states by how close they are to a recession signal being live.
 */
public enum SpreadState {
    /** Not inverted, or the hold period after re-steepening has passed. */
    NORMAL(0),
    /** Below the entry threshold; no persistence test has held yet. */
    INVERTED(1),
    /** A persistence test held during the current spell. */
    CONFIRMED(2),
    /** Back above the exit threshold after a confirmed spell, within the hold period. */
    RESTEEPENING(3);

    private final int code;

    SpreadState(int code) {
        this.code = code;
    }

    public int code() {
        return code;
    }
}
