package org.slopewatch.monitor;

import java.time.LocalDate;
import org.slopewatch.spread.SpreadKey;

/**
 * A change of state of one spread, dated on the market date it was detected on.
 *
 * @param spellId  the spell it belongs to (1, 2, … per spread), 0 for none
 * @param sequence the sequence number of the input that caused it
 */
public record Transition(SpreadKey spread, LocalDate date, SpreadState from, SpreadState to, String reason,
                         Evidence evidence, long spellId, long sequence) implements MonitorEvent {

    /** One log line, e.g. {@code GOVT-A 10Y-3M INVERTED -> CONFIRMED on 2026-06-30: quarter average -18.4 bp < 0 bp (2026Q2)}. */
    @Override
    public String toString() {
        return spread + " " + from + " -> " + to + " on " + date + ": " + reason;
    }

    /** Same outcome (ignoring the input sequence), the comparison revisions are judged by. */
    public boolean sameOutcome(Transition other) {
        return spread.equals(other.spread) && date.equals(other.date) && from == other.from && to == other.to
                && evidence.test().equals(other.evidence.test()) && spellId == other.spellId;
    }
}
