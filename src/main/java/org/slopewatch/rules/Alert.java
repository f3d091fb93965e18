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
 * @param kind        opening notice (the condition now holds), standing notice (it still holds) or closing
 *                    notice (it no longer holds)
 * @param subject     one line: what happened, then the kind and the severity in words, e.g.
 *                    {@code GOVT-A:10Y-3M confirmed inverted at -23.4 bp — opening notice, critical}
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

    /** Why this notice is sent: the condition now holds, still holds, or no longer holds. */
    public enum Kind {
        OPENING, STANDING, CLOSING;

        /** The kind in data (JSON, metric labels, log fields): {@code opening}, {@code standing}, {@code closing}. */
        public String label() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }

        /** The kind in words, e.g. {@code opening notice}. */
        public String words() {
            return label() + " notice";
        }

        /**
         * A kind as the journal stores it; a journal written before the present names holds the
         * old ones, which read as the kinds that replaced them.
         *
         * @throws IllegalArgumentException for a value that is no kind, old or new
         */
        public static Kind fromStored(String stored) {
            Kind k = DeprecatedNames.storedKind(stored);
            if (k == null) {
                throw new IllegalArgumentException("no notice kind " + stored);
            }
            return k;
        }

        /** Every value the journal may hold for this kind: its name, and the name it had before. */
        public java.util.List<String> storedNames() {
            return java.util.List.of(name(), DeprecatedNames.oldStoredName(this));
        }
    }

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
