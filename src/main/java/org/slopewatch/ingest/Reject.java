package org.slopewatch.ingest;

/**
 * A quote message that was not accepted, with what was wrong and the offending input.
 *
 * @param item   position of the item in its request or record (0-based), -1 if not applicable
 * @param raw    the input as received (shortened if long), for the journal and the dead-letter topic
 */
public record Reject(RejectReason reason, String detail, int item, String raw) {

    private static final int MAX_RAW = 2_000;

    public Reject {
        if (raw != null && raw.length() > MAX_RAW) {
            raw = raw.substring(0, MAX_RAW) + "…";
        }
    }

    @Override
    public String toString() {
        return (item >= 0 ? "item " + item + ": " : "") + reason.code() + ": " + detail;
    }
}
