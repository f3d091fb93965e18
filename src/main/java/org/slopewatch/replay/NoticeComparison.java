package org.slopewatch.replay;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Compares opening notices: those that fired live with those a policy tried would fire, episode by
 * episode, matched by rule name and subject and paired by {@link EpisodePairing}. Standing notices are left
 * out on both sides because their timing is wall-clock time, not market time.
 */
final class NoticeComparison {

    /**
     * Notices further apart than this are taken for different episodes: a year is longer than any
     * confirmation rule in use delays a notice, and shorter than the gap between inversion cycles.
     */
    static final int PAIRING_WINDOW_DAYS = 366;

    /** The number of a spread's observation dates after {@code from}, up to and including {@code to}. */
    @FunctionalInterface
    interface MarketDays {
        long between(String subject, LocalDate from, LocalDate to);
    }

    private NoticeComparison() {
    }

    /**
     * @param tried opening notices the policy tried would send
     * @param live  opening notices that fired live (already narrowed to the spreads compared)
     */
    static List<WhatIfReport.Comparison> compare(List<WhatIfReport.Notice> tried, List<LiveNotice> live, MarketDays days) {
        Map<String, List<WhatIfReport.Notice>> triedByKey = new TreeMap<>();
        Map<String, List<LiveNotice>> liveByKey = new TreeMap<>();
        for (WhatIfReport.Notice n : tried) {
            triedByKey.computeIfAbsent(n.rule() + "|" + n.subject(), k -> new ArrayList<>()).add(n);
        }
        for (LiveNotice n : live) {
            liveByKey.computeIfAbsent(n.rule() + "|" + n.subject(), k -> new ArrayList<>()).add(n);
        }
        Set<String> keys = new TreeSet<>(triedByKey.keySet());
        keys.addAll(liveByKey.keySet());
        List<WhatIfReport.Comparison> rows = new ArrayList<>();
        for (String key : keys) {
            List<WhatIfReport.Notice> t = new ArrayList<>(triedByKey.getOrDefault(key, List.of()));
            List<LiveNotice> l = new ArrayList<>(liveByKey.getOrDefault(key, List.of()));
            t.sort(Comparator.comparing(WhatIfReport.Notice::marketDate));
            l.sort(Comparator.comparing(LiveNotice::marketDate));
            List<EpisodePairing.Pair> pairs = EpisodePairing.pair(l.stream().map(LiveNotice::marketDate).toList(),
                    t.stream().map(WhatIfReport.Notice::marketDate).toList(), PAIRING_WINDOW_DAYS);
            for (EpisodePairing.Pair p : pairs) {
                rows.add(row(p.live() == null ? null : l.get(p.live()), p.tried() == null ? null : t.get(p.tried()), days));
            }
        }
        rows.sort(Comparator.comparing(WhatIfReport.Comparison::subject).thenComparing(NoticeComparison::firstDate)
                .thenComparing(WhatIfReport.Comparison::rule));
        return rows;
    }

    private static WhatIfReport.Comparison row(LiveNotice live, WhatIfReport.Notice tried, MarketDays days) {
        if (tried == null) {
            return new WhatIfReport.Comparison(live.rule(), live.subject(), Difference.NOT_AT_ALL.label(), live.episodeSince(),
                    live.marketDate(), null, null, null, null);
        }
        if (live == null) {
            return new WhatIfReport.Comparison(tried.rule(), tried.subject(), Difference.EXTRA.label(), null, null,
                    tried.episodeSince(), tried.marketDate(), null, null);
        }
        long apart = ChronoUnit.DAYS.between(live.marketDate(), tried.marketDate());
        Difference d = apart == 0 ? Difference.SAME : apart < 0 ? Difference.EARLIER : Difference.LATER;
        LocalDate from = apart < 0 ? tried.marketDate() : live.marketDate();
        LocalDate to = apart < 0 ? live.marketDate() : tried.marketDate();
        return new WhatIfReport.Comparison(live.rule(), live.subject(), d.label(), live.episodeSince(), live.marketDate(),
                tried.episodeSince(), tried.marketDate(), Math.abs(apart), days.between(live.subject(), from, to));
    }

    private static LocalDate firstDate(WhatIfReport.Comparison c) {
        if (c.liveMarketDate() == null) {
            return c.triedMarketDate();
        }
        if (c.triedMarketDate() == null) {
            return c.liveMarketDate();
        }
        return c.liveMarketDate().isBefore(c.triedMarketDate()) ? c.liveMarketDate() : c.triedMarketDate();
    }
}
