package org.slopewatch.rules;

import org.slopewatch.monitor.SpreadState;

/** What makes an alert rule true. Exactly one per rule. */
public sealed interface AlertTrigger permits AlertTrigger.EntersState, AlertTrigger.InvertedForDays, AlertTrigger.ProbabilityAbove,
        AlertTrigger.FeedStale, AlertTrigger.SpreadBelow {

    /** The key it is written with under {@code when:}. */
    String key();

    /** A spread entering a state (and staying in it). */
    record EntersState(SpreadState state) implements AlertTrigger {
        public String key() {
            return "enters-state";
        }
    }

    /** A spell inverted for at least this many calendar days. */
    record InvertedForDays(int days) implements AlertTrigger {
        public String key() {
            return "inverted-for-days";
        }
    }

    /**
     * The model probability of recession above a level (0 &lt; level &lt; 1), read off the month
     * {@code month} says: the last complete one unless the policy asks for the month so far.
     */
    record ProbabilityAbove(double level, ProbabilityMonth month) implements AlertTrigger {

        public ProbabilityAbove {
            java.util.Objects.requireNonNull(month, "month");
        }

        /** On the last complete month, the default. */
        public ProbabilityAbove(double level) {
            this(level, ProbabilityMonth.COMPLETE);
        }

        public String key() {
            return "probability-above";
        }
    }

    /** A curve's feed gone stale (no quotes for the configured business hours). */
    record FeedStale() implements AlertTrigger {
        public String key() {
            return "feed-stale";
        }
    }

    /** A spread below a level in basis points. */
    record SpreadBelow(double bp) implements AlertTrigger {
        public String key() {
            return "spread-below-bp";
        }
    }
}
