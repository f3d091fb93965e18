package org.slopewatch.web;

import java.time.Instant;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.ProbabilityModels;

/** The shapes the read API returns (snake-case JSON). NaN never reaches JSON: it becomes null. */
final class ApiViews {

    private ApiViews() {
    }

    /** The latest snapshot of a curve. */
    record CurveView(String curve, LocalDate date, Map<String, Double> yieldsBp) {
        static CurveView of(CurveSnapshot s) {
            Map<String, Double> yields = new LinkedHashMap<>();
            for (int i = 0; i < s.size(); i++) {
                yields.put(s.tenor(i).toString(), s.yieldBp(i));
            }
            return new CurveView(s.curve(), s.date(), yields);
        }
    }

    /** A spell in progress or ended. */
    record SpellView(long id, LocalDate start, LocalDate confirmed, String confirmedBy, LocalDate end, long durationDays,
                     int observations, double deepestBp, LocalDate deepestDate, double invertedAreaBpDays) {
        static SpellView of(Spell s) {
            return s == null ? null : new SpellView(s.id(), s.start(), s.confirmed(), s.confirmedBy(), s.end(), s.durationDays(),
                    s.observations(), s.deepestBp(), s.deepestDate(), s.invertedAreaBpDays());
        }
    }

    /**
     * Where a spread stands. {@code state_code}: 0 NORMAL, 1 INVERTED, 2 CONFIRMED, 3 RESTEEPENING;
     * {@code days_inverted} counts from {@code inverted_since} (null when the latest value is not
     * below the entry threshold), which can be later than the open spell's start.
     */
    record SpreadView(String id, String curve, String spread, LocalDate date, Double valueBp, String state, int stateCode,
                      long daysInverted, LocalDate invertedSince, Double quarterToDateAverageBp, int quarterToDateObservations,
                      long observations, SpellView spell, ProbabilityView probability, ProbabilityView probabilityLastMonth) {
        static SpreadView of(SpreadStatus s, ProbabilityModels models) {
            return new SpreadView(s.id(), s.curve(), s.spread(), s.date(), finite(s.valueBp()), s.state().name(), s.state().code(),
                    s.daysInverted(), s.invertedSince(), finite(s.quarterToDateAverageBp()), s.quarterToDateObservations(), s.observations(),
                    SpellView.of(s.openSpell()), models.current(s).map(ProbabilityView::of).orElse(null),
                    models.lastMonth(s).map(ProbabilityView::of).orElse(null));
        }
    }

    /**
     * A recession probability with what it rests on, and its 90 % band when the policy gives the
     * coefficients' covariance (null otherwise: published coefficients often come without one).
     */
    record ProbabilityView(double value, Double band90Lower, Double band90Upper, String month, boolean provisional,
                           double monthAverageBp, int observations, String recessionMonth, String modelSource, String caution) {
        static ProbabilityView of(LiveProbability p) {
            return new ProbabilityView(p.probability(), p.band() == null ? null : p.band().lower(), p.band() == null ? null : p.band().upper(),
                    p.month().toString(), p.provisional(), p.averageBp(), p.observations(), p.targetMonth().toString(), p.source(),
                    Alert.CAUTION);
        }
    }

    /*
     * Lists as the journal held them at as_of, with the content hash of the rule set in force then:
     * one record per kind of row rather than one generic one, so that the OpenAPI document can name
     * the rows (an annotation takes a class, never a class with type arguments); next is where the
     * rest is when truncated.
     */

    /** The standing value of a spread on each market date, as recorded by {@code as_of}. */
    record HistoryAsOf(Instant asOf, String policyHash, List<JournalReader.HistoryPoint> items, boolean truncated, String next) {
    }

    /** Transitions as recorded by {@code as_of}. */
    record TransitionsAsOf(Instant asOf, String policyHash, List<JournalReader.StoredTransition> items, boolean truncated, String next) {
    }

    /** Rejected quotes as recorded by {@code as_of}. */
    record RejectsAsOf(Instant asOf, String policyHash, List<JournalReader.StoredReject> items, boolean truncated, String next) {
    }

    /**
     * A spread's status at a past moment, rebuilt from the quote messages recorded by then under
     * the rules in force now ({@code recomputed_under}); {@code policy_hash} names those in force then.
     */
    record SpreadAsOfView(Instant asOf, String policyHash, String recomputedUnder, long quotesReplayed, String method,
                          SpreadView spread) {
    }

    /** A spread's ended spells as they stood at {@code as_of}, recomputed as {@link SpreadAsOfView} is. */
    record SpellsAsOfView(Instant asOf, String policyHash, String recomputedUnder, long quotesReplayed, String method,
                          List<SpellView> spells) {
    }

    static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
