package org.slopewatch.rules;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.function.Consumer;
import org.slopewatch.curve.Resolution;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.Observation;
import org.slopewatch.monitor.PersistenceTest;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.RollingAverage;
import org.slopewatch.monitor.ShareInverted;
import org.slopewatch.text.Excerpt;

/**
 * The one reading of a persistence test, however it is written: as text, {@code days-inverted:90}
 * (replay's {@code --persistence}, or an item of a policy's {@code confirm} list), or as a policy's
 * one-key mapping, {@code days-inverted: { days: 90 }}. Both spellings end in {@link #build}, which
 * holds the parameters each test needs and their bounds, so a test is accepted, or refused in the
 * same words, wherever it was written. Text is read by {@link #parse}, the entry point of the
 * command line, and by the policy parser through {@link #read}.
 */
public final class PersistenceForms {

    /** The textual forms, as messages list them. */
    public static final String TEXT_FORMS = "quarter-average, days-inverted:DAYS, rolling-average:DAYS or share-inverted:DAYS:SHARE";

    /** The names of the tests, in the order documentation and messages give them. */
    static final Set<String> NAMES = new LinkedHashSet<>(List.of(QuarterAverage.NAME, DaysInverted.NAME, RollingAverage.NAME,
            ShareInverted.NAME));

    /** A parameter of a test, by its key in the mapping spelling. */
    enum Parameter {
        DAYS("days"), BELOW_BP("below-bp"), SHARE("share");

        final String key;

        Parameter(String key) {
            this.key = key;
        }
    }

    /** Where {@link #build} reports a refusal: the parameter at fault, or null for the test as a whole. */
    interface Refusals {
        void refuse(Parameter at, String message);
    }

    private PersistenceForms() {
    }

    /**
     * One textual form, e.g. {@code share-inverted:90:0.8}, as {@code replay --persistence} takes it.
     *
     * @param entryBp the entry threshold, which is the threshold of {@code quarter-average} and
     *                {@code rolling-average} in this form
     * @throws IllegalArgumentException saying what is wrong, in the words a policy file gets for the same text
     */
    public static PersistenceTest parse(String text, double entryBp) {
        if (!Double.isFinite(entryBp)) {
            throw new IllegalArgumentException("entry threshold must be a finite number, got " + entryBp);
        }
        if (!(Math.abs(entryBp) < Observation.MAX_MAGNITUDE_BP)) {
            throw new IllegalArgumentException("entry threshold must be at most " + (long) Observation.MAX_MAGNITUDE_BP + " bp in size, got " + entryBp);
        }
        List<String> refused = new ArrayList<>(1);
        PersistenceTest test = read(text, entryBp, refused::add);
        if (test == null) {
            throw new IllegalArgumentException(refused.get(0));
        }
        return test;
    }

    /**
     * One textual form, or null after one message to {@code refuse}: the text quoted, then what
     * {@link #build} or the reading of a number says (the words the mapping spelling gets at the
     * parameter), and the accepted forms when the text is not of its test's form. A default
     * threshold that is not finite (a policy's unreadable {@code enter-below-bp}, reported where it
     * was read) gives null and no message.
     */
    static PersistenceTest read(String text, double entryBp, Consumer<String> refuse) {
        String[] parts = text.strip().split(":", -1);
        String name = parts[0];
        if (!NAMES.contains(name)) {
            refuse.accept(unknown(text));
            return null;
        }
        List<Parameter> shape = textParameters(name);
        List<String> problems = new ArrayList<>();
        if (parts.length - 1 > shape.size()) {
            problems.add("'" + name + "' is written " + textForm(name));
        }
        Map<Parameter, Number> values = new EnumMap<>(Parameter.class);
        Set<Parameter> written = EnumSet.noneOf(Parameter.class);
        for (int i = 0; i < shape.size() && i + 1 < parts.length; i++) {
            Parameter p = shape.get(i);
            String part = parts[i + 1];
            String what = "'" + p.key + "'";
            written.add(p);
            if (p == Parameter.DAYS) {
                int v = YamlNode.integer(what, YamlNode.resolve(part), part, problems::add);
                if (v != Integer.MIN_VALUE) {
                    values.put(p, v);
                }
            } else {
                double v = YamlNode.number(what, YamlNode.resolve(part), part, problems::add);
                if (!Double.isNaN(v)) {
                    values.put(p, v);
                }
            }
        }
        // not of the form: too many parts, too few (build names the missing), or a part that is not a number
        boolean misshapen = !problems.isEmpty() || written.size() < shape.size();
        PersistenceTest test = build(name, values, written, entryBp, (at, message) -> problems.add(message));
        if (problems.isEmpty()) {
            return test;
        }
        refuse.accept("persistence test " + Excerpt.quoted(text) + ": " + String.join("; ", problems)
                + (misshapen ? " (expected " + TEXT_FORMS + ")" : ""));
        return null;
    }

    /**
     * The test {@code name} (one of {@link #NAMES}) with the parameters written, or null after
     * reporting each problem. {@code written} holds every parameter written, {@code values} those
     * whose value could be read: one written but unreadable was reported where it was read, and
     * only stops the test from being built. {@code defaultBelowBp} is the threshold of
     * {@code quarter-average} and {@code rolling-average} when {@code below-bp} is not written.
     */
    static PersistenceTest build(String name, Map<Parameter, Number> values, Set<Parameter> written, double defaultBelowBp,
                                 Refusals refusals) {
        boolean ok = values.keySet().equals(written);
        for (Parameter p : required(name)) {
            if (!written.contains(p)) {
                refusals.refuse(null, "'" + name + "' needs '" + p.key + "'" + (p == Parameter.SHARE ? " (a fraction such as 0.8)" : ""));
                ok = false;
            }
        }
        Number days = values.get(Parameter.DAYS);
        if (days != null && days.intValue() < 1) {
            refusals.refuse(Parameter.DAYS, "'days' must be at least 1, got " + days);
            ok = false;
        }
        Number share = values.get(Parameter.SHARE);
        if (share != null && !(share.doubleValue() > 0 && share.doubleValue() <= 1)) {
            refusals.refuse(Parameter.SHARE, "impossible threshold: 'share' must be above 0 and at most 1, got " + share.doubleValue());
            ok = false;
        } else if (share != null && Resolution.PROBABILITY.round(share.doubleValue()) == 0) {
            // a share is compared to six decimals, where this one is 0
            refusals.refuse(Parameter.SHARE, "impossible threshold: 'share' is compared to six decimals and must be at least 0.000001, got "
                    + share.doubleValue());
            ok = false;
        }
        Number below = values.get(Parameter.BELOW_BP);
        if (below != null && !(Math.abs(below.doubleValue()) < Observation.MAX_MAGNITUDE_BP)) {
            refusals.refuse(Parameter.BELOW_BP, "'below-bp' must be at most " + (long) Observation.MAX_MAGNITUDE_BP + " bp in size, got "
                    + below.doubleValue());
            ok = false;
        }
        double belowBp = below == null ? defaultBelowBp : below.doubleValue();
        if (!ok || !(Math.abs(belowBp) < Observation.MAX_MAGNITUDE_BP)) {
            return null;
        }
        return switch (name) {
            case QuarterAverage.NAME -> new QuarterAverage(belowBp);
            case DaysInverted.NAME -> new DaysInverted(days.intValue());
            case RollingAverage.NAME -> new RollingAverage(days.intValue(), belowBp);
            case ShareInverted.NAME -> new ShareInverted(days.intValue(), share.doubleValue());
            default -> throw new IllegalArgumentException(unknown(name));
        };
    }

    /** The keys a test takes in the mapping spelling. */
    static Set<String> keys(String name) {
        Set<String> keys = new LinkedHashSet<>();
        for (Parameter p : mappingParameters(name)) {
            keys.add(p.key);
        }
        return keys;
    }

    /** The message for a name that is not a test's. */
    static String unknown(String text) {
        return "unknown persistence test " + Excerpt.quoted(text) + " (expected " + TEXT_FORMS + ")";
    }

    /** The parameters of the textual form, in their order there. */
    private static List<Parameter> textParameters(String name) {
        return switch (name) {
            case DaysInverted.NAME, RollingAverage.NAME -> List.of(Parameter.DAYS);
            case ShareInverted.NAME -> List.of(Parameter.DAYS, Parameter.SHARE);
            default -> List.of();
        };
    }

    private static List<Parameter> mappingParameters(String name) {
        return switch (name) {
            case QuarterAverage.NAME -> List.of(Parameter.BELOW_BP);
            case RollingAverage.NAME -> List.of(Parameter.DAYS, Parameter.BELOW_BP);
            default -> textParameters(name);
        };
    }

    /** The parameters without a default: exactly those the textual form spells out (the others default to the entry threshold). */
    private static List<Parameter> required(String name) {
        return textParameters(name);
    }

    private static String textForm(String name) {
        StringBuilder form = new StringBuilder(name);
        for (Parameter p : textParameters(name)) {
            form.append(':').append(p.key.toUpperCase(Locale.ROOT));
        }
        return form.toString();
    }
}
