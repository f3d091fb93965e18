package org.slopewatch.monitor;

import java.time.LocalDate;

/**
 * Where one spread stands now, as dashboards and the API show it.
 *
 * <p>The one source of a spread's numbers for everything that shows them (API, dashboard,
 * notices): the days inverted and the date they count from are the ones a {@code days-inverted}
 * confirmation reports, the open spell's start the one its entry transition is dated on.
 *
 * @param openSpell     the spell in progress, or null
 * @param daysInverted  calendar days continuously below the entry threshold, counted from {@code invertedSince}
 * @param invertedSince the first date of that run, or null when the last value is not below the entry threshold
 * @param endedSpell    the last spell that ended, or null
 * @param months        the calendar-month averages the probability models read
 */
public record SpreadStatus(String id, String curve, String spread, LocalDate date, double valueBp, SpreadState state,
                           LocalDate stateSince, Spell openSpell, long daysInverted, LocalDate invertedSince, Spell endedSpell,
                           double quarterToDateAverageBp, int quarterToDateObservations, long observations, MonthAverages months) {

    public static SpreadStatus of(SpreadTrack track) {
        MonitorState s = track.state();
        return new SpreadStatus(track.spread().id(), track.spread().curve(), track.spread().spread(), s.lastDate(), s.lastValueBp(),
                s.state(), s.stateSince(), s.openSpell(), s.daysInverted(), s.invertedSince(), s.endedSpell(), s.quarterToDateAverageBp(),
                s.quarterToDateObservations(), track.observations(), MonthAverages.of(track));
    }
}
