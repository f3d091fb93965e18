package org.slopewatch.monitor;

import java.time.LocalDate;

/**
 * Where one spread stands now, as dashboards and the API show it.
 *
 * @param openSpell the spell in progress, or null
 * @param months    the calendar-month averages the probability models read
 */
public record SpreadStatus(String id, String curve, String spread, LocalDate date, double valueBp, SpreadState state,
                           LocalDate stateSince, Spell openSpell, long daysInverted, double quarterToDateAverageBp, int quarterToDateObservations,
                           long observations, MonthAverages months) {

    public static SpreadStatus of(SpreadTrack track) {
        MonitorState s = track.state();
        return new SpreadStatus(track.spread().id(), track.spread().curve(), track.spread().spread(), s.lastDate(), s.lastValueBp(),
                s.state(), s.stateSince(), s.openSpell(), s.daysInverted(), s.quarterToDateAverageBp(), s.quarterToDateObservations(), track.size(),
                MonthAverages.of(track));
    }
}
