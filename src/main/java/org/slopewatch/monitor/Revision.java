package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.List;
import org.slopewatch.spread.SpreadKey;

/**
 * A revised past value changed what the monitor concluded: the transitions from {@code from} on,
 * as first reported and as they stand after re-running the affected dates.
 *
 * @param spells the ended spells to write again, as they now stand: every one that ended on or
 *               after {@code from} (the only ones a value dated {@code from} can change)
 */
public record Revision(SpreadKey spread, LocalDate from, List<Transition> before, List<Transition> after, List<Spell> spells,
                       long sequence) implements MonitorEvent {

    public Revision {
        before = List.copyOf(before);
        after = List.copyOf(after);
        spells = List.copyOf(spells);
    }

    @Override
    public String toString() {
        return spread + " revision from " + from + ": " + before.size() + " transition(s) replaced by " + after.size();
    }
}
