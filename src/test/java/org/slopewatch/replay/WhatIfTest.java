package org.slopewatch.replay;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.PolicyException;

/**
 * A policy tried on a hand-built history, against the notices a live policy fired on it.
 *
 * <p>Sources of the expected dates: the rule definitions in {@code alert-rules/README.md}.
 * {@code quarter-average}: a complete calendar quarter averaging below the threshold confirms on
 * the first observation after the quarter, if the spell is still open. {@code days-inverted: N}:
 * confirms on the first observation at least N calendar days after the spell's first observation.
 * {@code inverted-for-days: N} holds from the first observation at least N calendar days into the
 * spell. A spell ends on the first observation at or above the exit threshold (here 0 bp, after
 * one observation), and a confirmed one then re-steepens. The expected dates below are computed
 * from these definitions and the series, not read off the engine.
 *
 * <p>The series (invented curves): GOVT-A 10Y−3M is +40 bp in January 2026, −10 bp from 2 February
 * to 31 July (−30 bp from 16 to 20 March), +20 bp from 3 August; GOVT-B is −15 bp from 2 January to
 * 30 June and +20 bp from 1 July; quotes on business days to 30 September.
 */
class WhatIfTest {

    /** What the daemon ran: confirmation by a calendar quarter averaging below 0 bp. */
    static final String LIVE = """
            watch:
              - spread: 10Y-3M
                confirm:
                  - quarter-average: { below-bp: 0 }
            alerts:
              - name: first-inversion
                when: { enters-state: INVERTED }
                severity: info
                channels: [log]
              - name: inversion-confirmed
                when: { enters-state: CONFIRMED }
                severity: critical
                channels: [log]
                closing-notice: true
              - name: deep-inversion
                when: { spread-below-bp: -25 }
                severity: warning
                channels: [log]
            """;

    /** The policy tried: confirmation after 90 calendar days inverted, a 60-day rule, no depth rule, a feed rule. */
    static final String TRIED = """
            watch:
              - spread: 10Y-3M
                confirm:
                  - days-inverted: { days: 90 }
            alerts:
              - name: first-inversion
                when: { enters-state: INVERTED }
                severity: info
                channels: [log]
              - name: inversion-confirmed
                when: { enters-state: CONFIRMED }
                severity: critical
                channels: [log]
                standing-every: 1d
                closing-notice: true
              - name: inverted-60-days
                when: { inverted-for-days: 60 }
                severity: warning
                channels: [log]
              - name: stale-feed
                when: { feed-stale: true }
                severity: warning
                channels: [log]
            """;

    static final LocalDate A_SPELL = LocalDate.of(2026, 2, 2);
    static final LocalDate A_END = LocalDate.of(2026, 8, 3);
    static final LocalDate B_SPELL = LocalDate.of(2026, 1, 2);
    static final LocalDate B_END = LocalDate.of(2026, 7, 1);
    static final LocalDate DEEP = LocalDate.of(2026, 3, 16);

    /** GOVT-A's first quarter averages above zero (January's +40 outweighs the rest); its second is all −10: confirmed after it. */
    static final LocalDate A_QUARTER_CONFIRMED = LocalDate.of(2026, 7, 1);
    /** GOVT-B's first quarter is all −15: confirmed on the first observation after it. */
    static final LocalDate B_QUARTER_CONFIRMED = LocalDate.of(2026, 4, 1);

    @Test
    void theTriedPolicysConfirmationMovesByTheDaysItsRuleSays() throws Exception {
        WhatIfReport r = run(TRIED, SpreadFilter.ALL, live());

        LocalDate aConfirmed = businessDayOnOrAfter(A_SPELL.plusDays(90)); // 2026-05-03 is a Sunday: 2026-05-04
        LocalDate bConfirmed = businessDayOnOrAfter(B_SPELL.plusDays(90)); // 2026-04-02
        assertThat(aConfirmed).isEqualTo(LocalDate.of(2026, 5, 4));
        assertThat(firing(r, "inversion-confirmed")).containsExactly("GOVT-B:10Y-3M " + bConfirmed + " since " + bConfirmed,
                "GOVT-A:10Y-3M " + aConfirmed + " since " + aConfirmed);
        assertThat(row(r, "inversion-confirmed", "GOVT-A:10Y-3M"))
                .as("days-inverted 90 confirms GOVT-A %d days before the quarter closes", ChronoUnit.DAYS.between(aConfirmed, A_QUARTER_CONFIRMED))
                .isEqualTo(new WhatIfReport.Comparison("inversion-confirmed", "GOVT-A:10Y-3M", "earlier", A_QUARTER_CONFIRMED,
                        A_QUARTER_CONFIRMED, aConfirmed, aConfirmed, ChronoUnit.DAYS.between(aConfirmed, A_QUARTER_CONFIRMED),
                        businessDaysAfterUpTo(aConfirmed, A_QUARTER_CONFIRMED)));
        assertThat(row(r, "inversion-confirmed", "GOVT-B:10Y-3M"))
                .as("GOVT-B's quarter closes on 1 April, a day before 90 days have passed")
                .isEqualTo(new WhatIfReport.Comparison("inversion-confirmed", "GOVT-B:10Y-3M", "later", B_QUARTER_CONFIRMED,
                        B_QUARTER_CONFIRMED, bConfirmed, bConfirmed, 1L, 1L));
    }

    @Test
    void everyKindOfDifferenceIsFound() throws Exception {
        WhatIfReport r = run(TRIED, SpreadFilter.ALL, live());

        assertThat(row(r, "first-inversion", "GOVT-A:10Y-3M")).isEqualTo(new WhatIfReport.Comparison("first-inversion", "GOVT-A:10Y-3M",
                "same", A_SPELL, A_SPELL, A_SPELL, A_SPELL, 0L, 0L));
        assertThat(row(r, "first-inversion", "GOVT-B:10Y-3M").difference()).isEqualTo("same");
        assertThat(row(r, "deep-inversion", "GOVT-A:10Y-3M")).as("the tried policy has no depth rule")
                .isEqualTo(new WhatIfReport.Comparison("deep-inversion", "GOVT-A:10Y-3M", "not-at-all", DEEP, DEEP, null, null, null, null));
        // inverted-for-days: 60 holds from the first observation 60 days into the spell; its episode is named by the spell start
        LocalDate a60 = businessDayOnOrAfter(A_SPELL.plusDays(60));
        LocalDate b60 = businessDayOnOrAfter(B_SPELL.plusDays(60));
        assertThat(row(r, "inverted-60-days", "GOVT-A:10Y-3M")).isEqualTo(new WhatIfReport.Comparison("inverted-60-days",
                "GOVT-A:10Y-3M", "extra", null, null, A_SPELL, a60, null, null));
        assertThat(row(r, "inverted-60-days", "GOVT-B:10Y-3M").triedMarketDate()).isEqualTo(b60).isEqualTo(LocalDate.of(2026, 3, 3));
        assertThat(row(r, "inversion-confirmed", "GOVT-A:10Y-3M").difference()).isEqualTo("earlier");
        assertThat(row(r, "inversion-confirmed", "GOVT-B:10Y-3M").difference()).isEqualTo("later");

        assertThat(r.comparison()).hasSize(7);
        assertThat(r.counts()).isEqualTo(new WhatIfReport.Counts(6, 2, 5, 2, 1, 1, 1, 2));
        assertThat(r.livePolicyHashes()).containsExactly("live-hash");
        assertThat(r.compared()).isTrue();
    }

    @Test
    void closingNoticesAreListedOnTheDayTheSpellEnds() throws Exception {
        WhatIfReport r = run(TRIED, SpreadFilter.ALL, live());
        List<String> resolved = r.wouldFire().stream().filter(n -> n.kind().equals("closing"))
                .map(n -> n.rule() + " " + n.subject() + " " + n.marketDate()).toList();
        assertThat(resolved).containsExactly("inversion-confirmed GOVT-B:10Y-3M " + B_END, "inversion-confirmed GOVT-A:10Y-3M " + A_END);
        assertThat(r.wouldFire()).extracting(WhatIfReport.Notice::kind).doesNotContain("standing");
    }

    @Test
    void theLivePolicyTriedAgainReproducesWhatFired() throws Exception {
        WhatIfReport r = run(LIVE, SpreadFilter.ALL, live());
        assertThat(r.comparison()).extracting(WhatIfReport.Comparison::difference).containsOnly("same").hasSize(5);
    }

    @Test
    void aSpreadFilterNarrowsBothSidesAndNamesWhatMatchedNothing() throws Exception {
        WhatIfReport r = run(TRIED, SpreadFilter.of(List.of("GOVT-B:10Y-3M", "GOVT-C:10Y-3M")), live());
        assertThat(r.spreads()).containsExactly("GOVT-B:10Y-3M");
        assertThat(r.comparison()).extracting(WhatIfReport.Comparison::subject).containsOnly("GOVT-B:10Y-3M");
        assertThat(r.counts().liveFirstNotices()).isEqualTo(2);
        assertThat(r.notes()).anyMatch(n -> n.startsWith("'GOVT-C:10Y-3M' matched no spread") && n.contains("GOVT-A, GOVT-B"));
    }

    @Test
    void feedRulesAndStandingNoticesAreLeftOutAndTheReportSaysSo() throws Exception {
        List<LiveNotice> live = new ArrayList<>(live());
        live.add(new LiveNotice("stale-feed", "GOVT-A", Alert.Kind.OPENING, A_SPELL, A_SPELL, "live-hash"));
        WhatIfReport r = run(TRIED, SpreadFilter.ALL, live);
        assertThat(r.comparison()).extracting(WhatIfReport.Comparison::rule).doesNotContain("stale-feed");
        assertThat(r.notes()).anyMatch(n -> n.startsWith("Feed rules (stale-feed) do not apply offline"))
                .anyMatch(n -> n.startsWith("Standing notices are not evaluated"))
                .anyMatch(n -> n.equals("1 live opening notice(s) about feeds are left out of the comparison."));
        assertThat(r.caution()).isEqualTo(ReplayReport.CAUTION);
    }

    @Test
    void withoutLiveNoticesOnlyWhatWouldFireIsListed() throws Exception {
        WhatIfReport r = run(TRIED, SpreadFilter.ALL, null);
        assertThat(r.compared()).isFalse();
        assertThat(r.comparison()).isEmpty();
        assertThat(r.counts().wouldFire()).isEqualTo(6);
        assertThat(r.notes()).anyMatch(n -> n.startsWith("History from a file"));
    }

    @Test
    void thePolicyIsNamedByTheSha256OfItsBytes() throws PolicyException {
        // FIPS 180-2, appendix B.1: SHA-256("abc")
        assertThat(CandidatePolicy.sha256("abc".getBytes(StandardCharsets.US_ASCII)))
                .isEqualTo("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
        CandidatePolicy p = CandidatePolicy.parse("tried.yaml", TRIED.getBytes(StandardCharsets.UTF_8));
        assertThat(p.sha256()).isEqualTo(CandidatePolicy.sha256(TRIED.getBytes(StandardCharsets.UTF_8))).hasSize(64);
    }

    // --- the history, the live notices, helpers ---

    /**
     * What a daemon running {@link #LIVE} journalled on this history, written down from LIVE's rules: first
     * inversions on each spell's first day, GOVT-A dipping below −25 bp on 16 March, the quarter-average
     * confirmations and their closing notices when the spells end.
     */
    static List<LiveNotice> live() {
        return List.of(
                notice("first-inversion", "GOVT-B:10Y-3M", Alert.Kind.OPENING, B_SPELL, B_SPELL),
                notice("first-inversion", "GOVT-A:10Y-3M", Alert.Kind.OPENING, A_SPELL, A_SPELL),
                notice("deep-inversion", "GOVT-A:10Y-3M", Alert.Kind.OPENING, DEEP, DEEP),
                notice("inversion-confirmed", "GOVT-B:10Y-3M", Alert.Kind.OPENING, B_QUARTER_CONFIRMED, B_QUARTER_CONFIRMED),
                notice("inversion-confirmed", "GOVT-B:10Y-3M", Alert.Kind.CLOSING, B_QUARTER_CONFIRMED, B_END),
                notice("inversion-confirmed", "GOVT-A:10Y-3M", Alert.Kind.OPENING, A_QUARTER_CONFIRMED, A_QUARTER_CONFIRMED),
                notice("inversion-confirmed", "GOVT-A:10Y-3M", Alert.Kind.CLOSING, A_QUARTER_CONFIRMED, A_END));
    }

    private static LiveNotice notice(String rule, String subject, Alert.Kind kind, LocalDate since, LocalDate on) {
        return new LiveNotice(rule, subject, kind, since, on, "live-hash");
    }

    static WhatIfReport run(String policy, SpreadFilter filter, List<LiveNotice> live) throws PolicyException {
        WhatIf w = new WhatIf(CandidatePolicy.parse("tried.yaml", policy.getBytes(StandardCharsets.UTF_8)), filter);
        for (LocalDate d : businessDays()) {
            w.quote("GOVT-A", d, yields(spreadA(d)));
            w.quote("GOVT-B", d, yields(spreadB(d)));
        }
        return w.report("test history", live);
    }

    static double spreadA(LocalDate d) {
        if (d.isBefore(A_SPELL)) {
            return 40;
        }
        if (!d.isBefore(A_END)) {
            return 20;
        }
        return !d.isBefore(DEEP) && !d.isAfter(DEEP.plusDays(4)) ? -30 : -10;
    }

    static double spreadB(LocalDate d) {
        return d.isBefore(B_END) ? -15 : 20;
    }

    private static Map<Tenor, Double> yields(double spreadBp) {
        return Map.of(Tenor.parse("3M"), 400.0, Tenor.parse("10Y"), 400.0 + spreadBp);
    }

    static List<LocalDate> businessDays() {
        List<LocalDate> out = new ArrayList<>();
        for (LocalDate d = LocalDate.of(2026, 1, 2); !d.isAfter(LocalDate.of(2026, 9, 30)); d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                out.add(d);
            }
        }
        return out;
    }

    static LocalDate businessDayOnOrAfter(LocalDate d) {
        return businessDays().stream().filter(b -> !b.isBefore(d)).findFirst().orElseThrow();
    }

    static long businessDaysAfterUpTo(LocalDate from, LocalDate to) {
        return businessDays().stream().filter(b -> b.isAfter(from) && !b.isAfter(to)).count();
    }

    private static List<String> firing(WhatIfReport r, String rule) {
        return r.wouldFire().stream().filter(n -> n.rule().equals(rule) && n.kind().equals("opening"))
                .map(n -> n.subject() + " " + n.marketDate() + " since " + n.episodeSince()).toList();
    }

    private static WhatIfReport.Comparison row(WhatIfReport r, String rule, String subject) {
        List<WhatIfReport.Comparison> rows = r.comparison().stream().filter(c -> c.rule().equals(rule) && c.subject().equals(subject)).toList();
        assertThat(rows).as("one comparison row for %s %s in %s", rule, subject, r.comparison()).hasSize(1);
        return rows.get(0);
    }
}
