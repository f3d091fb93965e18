package org.slopewatch.web;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.slopewatch.journal.AlertColumns;
import org.slopewatch.monitor.Watch;
import org.slopewatch.rules.AlertRule;
import org.slopewatch.rules.Policy;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.text.Excerpt;
import org.slopewatch.text.FieldText;

/**
 * What a mute, a mute's lift and an acknowledgement must satisfy before anything is kept: every
 * text fits its journal column ({@link AlertColumns#BY_CHARS} and the like) and holds no control
 * character ({@link FieldText}), and what a mute names exists in the policy in force, so that a
 * typo is an error rather than a mute of nothing. Each check answers with what is wrong, or null.
 *
 * @param curves the curves the daemon takes quotes for (empty: any)
 */
record AlertRequests(Policy policy, Set<String> curves) {

    /** The problem with a mute, or null; {@code rule} and {@code spread} stripped, exactly one of them given. */
    String mute(String rule, String spread, String reason, String by) {
        String problem = first(FieldText.problem("by", by, AlertColumns.BY_CHARS),
                FieldText.problem("reason", reason, AlertColumns.REASON_CHARS),
                FieldText.problem("rule", rule, AlertColumns.TARGET_CHARS),
                FieldText.problem("spread", spread, AlertColumns.TARGET_CHARS));
        if (problem != null) {
            return problem;
        }
        return rule != null ? knownRule(rule) : knownSpread(spread);
    }

    /** The problem with an acknowledgement, or null. */
    static String ack(String by, String note) {
        return first(FieldText.problem("by", by, AlertColumns.BY_CHARS), FieldText.problem("note", note, AlertColumns.NOTE_CHARS));
    }

    /** The problem with who lifts a mute, or null. */
    static String lift(String by) {
        return FieldText.problem("by", by, AlertColumns.BY_CHARS);
    }

    private String knownRule(String rule) {
        List<String> names = policy.alerts().stream().map(AlertRule::name).toList();
        return names.contains(rule) ? null
                : "no alert rule " + Excerpt.quoted(rule) + " in the policy in force (rules: " + String.join(", ", names) + ")";
    }

    /**
     * A spread name the policy watches ({@code 10Y-3M}: every curve), or an id {@code CURVE:SPREAD}
     * of a watched spread on a curve its watch applies to and the daemon takes.
     */
    private String knownSpread(String spread) {
        Set<String> names = new LinkedHashSet<>();
        for (Watch w : policy.watches()) {
            names.add(w.spread().name());
            if (w.spread().name().equals(spread)) {
                return null;
            }
            int colon = spread.lastIndexOf(':');
            if (colon > 0 && colon < spread.length() - 1) {
                SpreadKey key = SpreadKey.parse(spread);
                if (key.spread().equals(w.spread().name()) && w.appliesTo(key.curve())
                        && (curves.isEmpty() || curves.contains(key.curve()))) {
                    return null;
                }
            }
        }
        return "no spread " + Excerpt.quoted(spread) + " is watched by the policy in force (spreads: " + String.join(", ", names)
                + (curves.isEmpty() ? "" : "; curves: " + String.join(", ", new TreeSet<>(curves))) + "; give a name such as 10Y-3M "
                + "or an id such as CURVE:10Y-3M)";
    }

    private static String first(String... problems) {
        for (String p : problems) {
            if (p != null) {
                return p;
            }
        }
        return null;
    }
}
