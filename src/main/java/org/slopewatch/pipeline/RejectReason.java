package org.slopewatch.pipeline;

/** Why a quote was turned away. The {@link #code()} is the metric tag and the journal value. */
public enum RejectReason {
    MALFORMED("malformed"),
    MISSING_FIELD("missing-field"),
    BAD_DATE("bad-date"),
    FUTURE_DATE("future-date"),
    UNKNOWN_CURVE("unknown-curve"),
    UNKNOWN_TENOR("unknown-tenor"),
    UNKNOWN_UNIT("unknown-unit"),
    BAD_BASIS("bad-basis"),
    NOT_FINITE("not-finite"),
    IMPLAUSIBLE("implausible");

    private final String code;

    RejectReason(String code) {
        this.code = code;
    }

    public String code() {
        return code;
    }
}
