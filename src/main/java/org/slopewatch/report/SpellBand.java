package org.slopewatch.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.replay.SpreadReport;

/**
 * An inversion spell as the chart shades it.
 *
 * @param confirmed the date a persistence test held, or null
 * @param end       the date the spell was found over, or null while it is still open
 */
public record SpellBand(long id, LocalDate start, LocalDate confirmed, LocalDate end) {

    public static SpellBand of(SpreadReport.SpellRow row) {
        return new SpellBand(row.id(), row.start(), row.confirmed(), row.end());
    }

    /**
     * The spells told by a spread's transitions: each carries its spell's id, the move into
     * {@code INVERTED} opens it, into {@code CONFIRMED} confirms it, and into {@code NORMAL} or
     * {@code RESTEEPENING} ends it. The journal keeps transitions for every spell, open or ended,
     * so this is how a report from the journal finds them.
     */
    public static List<SpellBand> fromTransitions(List<SpreadReport.TransitionRow> transitions) {
        Map<Long, SpellBand> byId = new LinkedHashMap<>();
        for (SpreadReport.TransitionRow t : transitions) {
            if (t.spell() <= 0) {
                continue; // the end of a hold period belongs to no spell
            }
            SpellBand b = byId.get(t.spell());
            if (t.to().equals(SpreadState.INVERTED.name())) {
                byId.put(t.spell(), new SpellBand(t.spell(), t.date(), null, null));
            } else if (b != null && t.to().equals(SpreadState.CONFIRMED.name())) {
                byId.put(t.spell(), new SpellBand(b.id(), b.start(), t.date(), null));
            } else if (b != null && (t.to().equals(SpreadState.NORMAL.name()) || t.to().equals(SpreadState.RESTEEPENING.name()))) {
                byId.put(t.spell(), new SpellBand(b.id(), b.start(), b.confirmed(), t.date()));
            }
        }
        return new ArrayList<>(byId.values());
    }
}
