package org.slopewatch.monitor;

import java.time.LocalDate;
import java.util.List;
import org.slopewatch.spread.SpreadKey;

/**
 * A revised past value left every transition as it was but changed the figures of ended spells
 * (deepest value, its date, area, observations): the spells as they now stand, to be written over
 * the ones first reported under the same ids. A {@link Revision} covers the case where transitions
 * change; this one is what keeps a spell's figures from going stale when none does.
 *
 * @param from the revised value's date
 */
public record SpellRestatement(SpreadKey spread, LocalDate from, List<Spell> spells, long sequence) implements MonitorEvent {

    public SpellRestatement {
        spells = List.copyOf(spells);
        if (spells.isEmpty()) {
            throw new IllegalArgumentException("a restatement of " + spread + " from " + from + " restates no spell");
        }
    }

    @Override
    public String toString() {
        return spread + " restatement from " + from + ": spell(s) " + spells.stream().map(Spell::id).toList();
    }
}
