package org.slopewatch.replay;

import java.time.LocalDate;
import java.util.List;

/**
 * What a policy tried on stored history would have fired, and how that differs from what did
 * fire. Field names become the JSON keys (snake case).
 *
 * @param source       the history: a file, or the journal's address without credentials
 * @param policy       where the policy tried came from
 * @param policySha256 SHA-256 of the policy file's bytes
 * @param spreadFilter the spreads asked for (empty: every spread the policy watches)
 * @param quotes       quote messages (or snapshots of a file) run through the engine
 * @param spreads      the spread ids evaluated, in the order they were first seen
 * @param compared     whether there was a record of live notices to compare with (not for a file)
 * @param wouldFire    opening and closing notices the policy tried would have sent, by market date
 * @param comparison   one row per episode, live and tried paired by rule and subject; empty when not compared
 * @param livePolicyHashes the content hashes of the policies the compared live notices were decided under
 * @param notes        what the reader must know to read the numbers: what an offline run cannot do
 */
public record WhatIfReport(String source, String policy, String policySha256, List<String> spreadFilter, long quotes,
                           LocalDate firstDate, LocalDate lastDate, List<String> spreads, boolean compared,
                           List<Notice> wouldFire, List<Comparison> comparison, Counts counts, List<String> livePolicyHashes,
                           List<String> notes, String caution) {

    public WhatIfReport {
        spreadFilter = List.copyOf(spreadFilter);
        spreads = List.copyOf(spreads);
        wouldFire = List.copyOf(wouldFire);
        comparison = List.copyOf(comparison);
        livePolicyHashes = List.copyOf(livePolicyHashes);
        notes = List.copyOf(notes);
    }

    /**
     * A notice the policy tried would have sent.
     *
     * @param kind         {@code opening} or {@code closing}
     * @param episodeSince the market date the condition began (names the episode, as in live alert ids)
     * @param marketDate   the market date the notice would have been decided on
     */
    public record Notice(String rule, String subject, String severity, String kind, LocalDate episodeSince, LocalDate marketDate) {
    }

    /**
     * One episode's opening notice live and under the policy tried.
     *
     * @param difference   {@code same}, {@code earlier}, {@code later}, {@code not-at-all} or {@code extra}
     * @param calendarDays days between the two notices' market dates (null unless both exist)
     * @param marketDays   the spread's observation dates after the earlier notice up to the later one
     */
    public record Comparison(String rule, String subject, String difference, LocalDate liveEpisodeSince, LocalDate liveMarketDate,
                             LocalDate triedEpisodeSince, LocalDate triedMarketDate, Long calendarDays, Long marketDays) {
    }

    /**
     * Totals. {@code wouldFire} and {@code liveFirstNotices} count opening notices only.
     */
    public record Counts(int wouldFire, int wouldResolve, int liveFirstNotices, int same, int earlier, int later, int notAtAll,
                         int extra) {
    }
}
