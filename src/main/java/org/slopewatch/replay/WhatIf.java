package org.slopewatch.replay;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.SpreadTrack;
import org.slopewatch.monitor.Watch;
import org.slopewatch.rules.AlertConditions;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertDecision;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.rules.AlertRule;
import org.slopewatch.rules.AlertTrigger;
import org.slopewatch.rules.Policy;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.text.Excerpt;

/**
 * What another policy would have fired on stored history: quotes go through a fresh curve book,
 * signal engine and rule engine of that policy, built here and owned by nobody else, so the
 * daemon's live state is never touched. Market dates are the clock: the rules are evaluated
 * after each quote's step, as the daemon evaluates them after each batch.
 *
 * <p>Feed rules do not apply (a stale feed is about when quotes arrived, which stored market data
 * does not say) and standing notices are not kept (their intervals are wall-clock time). Not thread-safe:
 * one run feeds one instance.
 */
public final class WhatIf {

    private final CandidatePolicy candidate;
    private final SpreadFilter filter;
    private final List<String> feedRules = new ArrayList<>();
    private final List<AlertRule> rules = new ArrayList<>();
    private final SignalEngine engine;
    private final AlertEngine alerts;
    private final CurveBook book = new CurveBook();
    private final Set<SpreadKey> touched = new LinkedHashSet<>();
    private final Set<String> curves = new TreeSet<>();
    private final List<WhatIfReport.Notice> notices = new ArrayList<>();
    private final List<String> callerNotes = new ArrayList<>();
    private long quotes;
    private LocalDate first;
    private LocalDate last;

    public WhatIf(CandidatePolicy candidate, SpreadFilter filter) {
        this.candidate = candidate;
        this.filter = filter;
        Policy policy = candidate.policy();
        for (AlertRule r : policy.alerts()) {
            if (r.when() instanceof AlertTrigger.FeedStale) {
                feedRules.add(r.name());
            } else {
                rules.add(r);
            }
        }
        List<Watch> watches = filter.narrow(policy.watches());
        this.engine = watches.isEmpty() ? null : new SignalEngine(watches);
        this.alerts = new AlertEngine(rules);
    }

    /** One quote message (some tenors of a curve on a date): merged into its snapshot as the daemon does, then one step. */
    public void quote(String curve, LocalDate date, Map<Tenor, Double> yieldsBp) {
        quotes++;
        curves.add(curve);
        first = first == null || date.isBefore(first) ? date : first;
        last = last == null || date.isAfter(last) ? date : last;
        if (engine == null) {
            return;
        }
        CurveSnapshot snapshot = book.apply(curve, date, yieldsBp);
        touched.clear();
        engine.onSnapshot(snapshot, quotes, (key, observation) -> touched.add(key));
        if (touched.isEmpty()) {
            return;
        }
        List<SpreadStatus> changed = new ArrayList<>(touched.size());
        Map<String, SpreadStatus> byId = new HashMap<>();
        for (SpreadKey key : touched) {
            SpreadStatus s = SpreadStatus.of(engine.track(key));
            changed.add(s);
            byId.put(s.id(), s);
        }
        Policy policy = candidate.policy();
        List<AlertDecision> decisions = alerts.decide(AlertConditions.of(rules, changed, Map.of(), policy.probability()), clock(date));
        for (AlertDecision d : decisions) {
            if (d.notice() == Alert.Kind.STANDING) {
                continue;
            }
            notices.add(new WhatIfReport.Notice(d.rule().name(), d.subject(), d.rule().severity().name().toLowerCase(Locale.ROOT),
                    d.notice().label(), d.since(), byId.get(d.subject()).date()));
        }
    }

    /** One snapshot of a history file, as one quote message. */
    public void snapshot(CurveSnapshot snapshot) {
        quote(snapshot.curve(), snapshot.date(), snapshot.asMap());
    }

    /** Quote messages taken so far. */
    public long quotes() {
        return quotes;
    }

    /** A note the caller knows and the run does not (e.g. how the history was read). */
    public void note(String note) {
        callerNotes.add(note);
    }

    /**
     * The report.
     *
     * @param live the notices that fired live, or null when there is nothing to compare with (a file)
     */
    public WhatIfReport report(String source, List<LiveNotice> live) {
        List<WhatIfReport.Notice> wouldFire = new ArrayList<>(notices);
        wouldFire.sort(Comparator.comparing(WhatIfReport.Notice::marketDate)); // stable: decision order within a date
        List<WhatIfReport.Notice> firstNotices = wouldFire.stream().filter(n -> n.kind().equals(Alert.Kind.OPENING.label())).toList();
        List<String> notes = new ArrayList<>();
        notes.add("Market dates are the clock: each " + (live == null ? "snapshot (a curve on a date)" : "quote message")
                + " is one step, taken in recorded order, and the rules are evaluated after each step.");
        notes.add("Standing notices are not evaluated: their intervals are wall-clock time, which an offline run does not have; opening notices"
                + (live == null ? "" : " (compared with what fired)") + " and closing notices are listed.");
        if (!feedRules.isEmpty()) {
            notes.add("Feed rules (" + String.join(", ", feedRules) + ") do not apply offline: a stale feed is about when quotes"
                    + " arrived, which market data does not record.");
        }
        List<WhatIfReport.Comparison> comparison = List.of();
        List<String> hashes = new ArrayList<>();
        int liveFirst = 0;
        if (live == null) {
            notes.add("History from a file: nothing fired live to compare with, so only what would fire is listed.");
        } else {
            List<LiveNotice> compared = new ArrayList<>();
            int aboutFeeds = 0;
            for (LiveNotice n : live) {
                if (!n.aboutSpread()) {
                    aboutFeeds += n.kind() == Alert.Kind.OPENING ? 1 : 0;
                } else if (n.kind() == Alert.Kind.OPENING && filter.matches(n.subject())) {
                    compared.add(n);
                    if (n.policyHash() != null && !hashes.contains(n.policyHash())) {
                        hashes.add(n.policyHash());
                    }
                }
            }
            liveFirst = compared.size();
            comparison = NoticeComparison.compare(firstNotices, compared, this::marketDays);
            notes.add("Live, the rules are evaluated after each batch of quotes the daemon takes: a condition that began and"
                    + " cleared inside one batch shows here but never fired live, and a notice is dated on the batch's last date.");
            notes.add("Episodes of one rule and subject are paired in date order, as close as possible and never more than "
                    + NoticeComparison.PAIRING_WINDOW_DAYS + " days apart; a notice left unpaired is not-at-all (live) or extra"
                    + " (tried). Live notices include those held back by a quiet period, which are journalled but not sent.");
            if (aboutFeeds > 0) {
                notes.add(aboutFeeds + " live opening notice(s) about feeds are left out of the comparison.");
            }
        }
        notes.addAll(unmatchedFilterNotes());
        notes.addAll(callerNotes);
        return new WhatIfReport(source, candidate.source(), candidate.sha256(), filter.entries(), quotes, first, last, spreadIds(),
                live != null, wouldFire, comparison, counts(wouldFire, liveFirst, comparison), hashes, notes, ReplayReport.CAUTION);
    }

    private List<String> spreadIds() {
        return engine == null ? List.of() : engine.tracks().stream().map(t -> t.spread().id()).toList();
    }

    private List<String> unmatchedFilterNotes() {
        List<String> out = new ArrayList<>();
        List<String> ids = spreadIds();
        for (String entry : filter.entries()) {
            if (ids.stream().noneMatch(id -> id.equals(entry) || id.endsWith(":" + entry))) {
                out.add(Excerpt.quoted(entry) + " matched no spread with values: this policy watches "
                        + String.join(", ", candidate.policy().watches().stream().map(w -> w.spread().name()).distinct().toList())
                        + (curves.isEmpty() ? "" : "; curves in the history: " + String.join(", ", curves)) + ".");
            }
        }
        return out;
    }

    /** Observation dates of a spread after {@code from}, up to and including {@code to}. */
    private long marketDays(String subject, LocalDate from, LocalDate to) {
        SpreadTrack track = engine == null ? null : engine.track(SpreadKey.parse(subject));
        return track == null ? 0 : countAtOrBefore(track, to) - countAtOrBefore(track, from);
    }

    private static int countAtOrBefore(SpreadTrack track, LocalDate date) {
        int lo = 0;
        int hi = track.size();
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (track.date(mid).isAfter(date)) {
                hi = mid;
            } else {
                lo = mid + 1;
            }
        }
        return lo;
    }

    private static WhatIfReport.Counts counts(List<WhatIfReport.Notice> wouldFire, int liveFirst, List<WhatIfReport.Comparison> rows) {
        Map<String, Long> by = rows.stream().collect(Collectors.groupingBy(WhatIfReport.Comparison::difference, Collectors.counting()));
        int firing = (int) wouldFire.stream().filter(n -> n.kind().equals(Alert.Kind.OPENING.label())).count();
        return new WhatIfReport.Counts(firing, wouldFire.size() - firing, liveFirst, count(by, Difference.SAME),
                count(by, Difference.EARLIER), count(by, Difference.LATER), count(by, Difference.NOT_AT_ALL), count(by, Difference.EXTRA));
    }

    private static int count(Map<String, Long> by, Difference d) {
        return by.getOrDefault(d.label(), 0L).intValue();
    }

    /** The instant a market date stands for in the rule engine; only standing intervals read it, and standing notices are dropped. */
    private static Instant clock(LocalDate date) {
        return date.atStartOfDay(ZoneOffset.UTC).toInstant();
    }
}
