package org.slopewatch.pipeline;

import org.slopewatch.text.Excerpt;

/**
 * A quote message that was not accepted, with what was wrong and the offending input.
 *
 * @param detail what was wrong, cut to {@link #MAX_DETAIL} characters with control characters
 *               escaped: it quotes the input (as excerpts), and it is answered, journalled and logged
 * @param item   position of the item in its request or record (0-based), -1 if not applicable
 * @param raw    the input as received (shortened if long), for the journal and the dead-letter topic
 */
public record Reject(RejectReason reason, String detail, int item, String raw) {

    private static final int MAX_RAW = 2_000;
    static final int MAX_DETAIL = 400;

    public Reject {
        detail = Excerpt.cut(detail, MAX_DETAIL);
        if (raw != null && raw.length() > MAX_RAW) {
            raw = raw.substring(0, MAX_RAW) + "…";
        }
    }

    @Override
    public String toString() {
        return (item >= 0 ? "item " + item + ": " : "") + reason.code() + ": " + detail;
    }
}
