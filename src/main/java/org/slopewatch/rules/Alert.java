package org.slopewatch.rules;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Objects;

/**
 * One notice to deliver: what happened and why, in plain words, with the caution at the end.
 *
 * @param id          deterministic (rule, spread, spell, kind, sequence of the notice), so that a
 *                    restart or a second instance never creates the same notice twice
 * @param kind        first notice, a repeat while the condition holds, or the resolve notice
 * @param subject     one line: severity, spread and state, e.g. {@code [CRITICAL] GOVT-A 10Y-3M CONFIRMED}
 * @param text        the body in plain text, several lines, ending with {@link #CAUTION}
 * @param facts       the evidence as label/value pairs, in order (for HTML and JSON bodies)
 * @param dashboard   a link to the dashboard, or null
 */
public record Alert(String id, String rule, Severity severity, Kind kind, String spreadId, LocalDate marketDate, String state,
                    String subject, String text, List<Fact> facts, String dashboard, Instant createdAt) {

    /** The caution every alert ends with. */
    public static final String CAUTION = "A statistical signal, not investment advice: decisions rest with the desk's own risk "
            + "policy and licensed professionals. Inversions have given false alarms, and central-bank balance-sheet policy can "
            + "distort term spreads.";

    /** Why this notice is sent. */
    public enum Kind { FIRING, REPEAT, RESOLVED }

    /** One labelled piece of evidence, e.g. {@code days inverted: 92}. */
    public record Fact(String label, String value) {
    }

    public Alert {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(rule, "rule");
        Objects.requireNonNull(severity, "severity");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(subject, "subject");
        Objects.requireNonNull(text, "text");
        facts = List.copyOf(facts);
    }
}
