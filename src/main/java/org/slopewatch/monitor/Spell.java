package org.slopewatch.monitor;

import java.time.LocalDate;
import org.slopewatch.spread.SpreadKey;

/**
 * One inversion spell, from the first observation below the entry threshold to the observation
 * that ended it. Reported as an event when it ends; an open spell is read off the state.
 *
 * @param id                  1, 2, … per spread
 * @param confirmed           the date a persistence test held, or null for a short spell
 * @param confirmedBy         the test that confirmed it, or null
 * @param end                 the date the spell was found over, or null while open
 * @param durationDays        calendar days from start to end (to the last observation while open)
 * @param observations        observations from start to end, both included
 * @param deepestBp           the lowest value seen in the spell
 * @param invertedAreaBpDays  the area below the entry threshold, each observation's depth held
 *                            until the next observation
 */
public record Spell(SpreadKey spread, long id, LocalDate start, LocalDate confirmed, String confirmedBy, LocalDate end,
                   long durationDays, int observations, double deepestBp, LocalDate deepestDate,
                   double invertedAreaBpDays) implements MonitorEvent {

    public boolean isOpen() {
        return end == null;
    }

    public boolean wasConfirmed() {
        return confirmed != null;
    }
}
