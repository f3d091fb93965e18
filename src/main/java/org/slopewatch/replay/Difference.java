package org.slopewatch.replay;

/**
 * How one episode's opening notice under the policy tried compares with the one that fired live,
 * matched by rule name and subject. The labels are what reports print.
 */
public enum Difference {
    /** Both on the same market date. */
    SAME("same"),
    /** The policy tried would have notified before the live one. */
    EARLIER("earlier"),
    /** The policy tried would have notified after the live one. */
    LATER("later"),
    /** Fired live; the policy tried would not have fired it. */
    NOT_AT_ALL("not-at-all"),
    /** The policy tried would have fired it; nothing fired live. */
    EXTRA("extra");

    private final String label;

    Difference(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }
}
