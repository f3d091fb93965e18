package org.slopewatch.journal;

/**
 * What the alert tables' text columns hold (V2__alerts.sql), for the stores that cut a text to its
 * column and for the API's checks, which refuse a longer one before anything is kept.
 */
public final class AlertColumns {

    /** Who acts: {@code alert_ack.acked_by}, {@code mute.muted_by}, {@code mute.lifted_by}. */
    public static final int BY_CHARS = 100;
    /** {@code alert_ack.note}. */
    public static final int NOTE_CHARS = 400;
    /** {@code mute.reason}. */
    public static final int REASON_CHARS = 400;
    /** {@code mute.target}: a rule's name or a spread. */
    public static final int TARGET_CHARS = 120;
    /** {@code alert.muted_by}: the mute that silenced a notice, described with its reason, can be longer. */
    static final int MUTED_BY_CHARS = 400;

    private AlertColumns() {
    }
}
