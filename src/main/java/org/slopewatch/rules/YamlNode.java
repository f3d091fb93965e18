package org.slopewatch.rules;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.BinaryOperator;
import java.util.function.Consumer;
import java.util.regex.Pattern;
import org.slopewatch.text.Excerpt;
import org.snakeyaml.engine.v2.api.LoadSettings;
import org.snakeyaml.engine.v2.exceptions.Mark;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.NodeTuple;
import org.snakeyaml.engine.v2.nodes.ScalarNode;
import org.snakeyaml.engine.v2.nodes.SequenceNode;
import org.snakeyaml.engine.v2.nodes.Tag;
import org.snakeyaml.engine.v2.resolver.ScalarResolver;

/**
 * Typed, position-aware reading of a composed YAML tree. Every failed expectation is recorded
 * as a {@link PolicyProblem} at the node's position and reading goes on, so that one run reports
 * every mistake in a file.
 */
final class YamlNode {

    /** YAML's spellings of infinity and not-a-number, which the core schema tags as floats. */
    private static final Pattern NON_FINITE = Pattern.compile("[-+]?\\.(inf|Inf|INF|nan|NaN|NAN)");
    /** The resolver of the schema {@link PolicyParser} reads with (the reader's default). */
    private static final ScalarResolver RESOLVER = LoadSettings.builder().build().getSchema().getScalarResolver();

    private final String file;
    private final Node node;
    private final Problems problems;

    YamlNode(String file, Node node, Problems problems) {
        this.file = file;
        this.node = node;
        this.problems = problems;
    }

    void problem(String message) {
        problems.add(at(node, message));
    }

    PolicyProblem at(Node n, String message) {
        Optional<Mark> mark = n.getStartMark();
        return new PolicyProblem(file, mark.map(m -> m.getLine() + 1).orElse(0), mark.map(m -> m.getColumn() + 1).orElse(0), message);
    }

    /** An empty value ({@code key:} with nothing after it). */
    boolean isNull() {
        return node instanceof ScalarNode s && (Tag.NULL.equals(s.getTag()) || s.getValue().isEmpty());
    }

    boolean isMapping() {
        return node instanceof MappingNode;
    }

    boolean isSequence() {
        return node instanceof SequenceNode;
    }

    /**
     * The entries of a mapping in file order, reporting keys outside {@code allowed} as unknown
     * and duplicate keys. Empty (with a problem recorded) if this is not a mapping.
     */
    Map<String, YamlNode> mapping(String what, Set<String> allowed) {
        return mapping(what, allowed, Map.of(), null);
    }

    /**
     * As {@link #mapping(String, Set)}, reading a key of {@code renamed} (old name → new name) as
     * its new name, with the warning {@code warning} makes of the two names; the old and the new
     * name of one key together are the same key twice.
     */
    Map<String, YamlNode> mapping(String what, Set<String> allowed, Map<String, String> renamed, BinaryOperator<String> warning) {
        Map<String, YamlNode> out = new LinkedHashMap<>();
        if (!(node instanceof MappingNode m)) {
            problem(what + " must be a mapping of keys to values");
            return out;
        }
        for (NodeTuple t : m.getValue()) {
            if (!(t.getKeyNode() instanceof ScalarNode k)) {
                problems.add(at(t.getKeyNode(), "keys in " + what + " must be plain words"));
                continue;
            }
            String key = k.getValue();
            String newer = renamed.get(key);
            if (newer != null) {
                problems.warn(at(k, warning.apply(key, newer)));
                key = newer;
            }
            if (!allowed.contains(key)) {
                problems.add(at(k, "unknown key " + Excerpt.quoted(key) + " in " + what + (allowed.isEmpty() ? "" : " (known: " + String.join(", ", allowed) + ")")));
                continue;
            }
            if (out.containsKey(key)) {
                problems.add(at(k, "key " + Excerpt.quoted(key) + " appears twice in " + what));
                continue;
            }
            out.put(key, new YamlNode(file, t.getValueNode(), problems));
        }
        return out;
    }

    /** One entry of a mapping whose keys are names of the user's own, with the key's node for positions. */
    record Entry(String key, YamlNode keyNode, YamlNode value) {
    }

    /**
     * The entries of a mapping in file order with their key nodes, for keys the caller checks
     * itself (such as spread names); reports keys that are not plain words and duplicate keys.
     * Empty (with a problem recorded) if this is not a mapping.
     */
    List<Entry> entries(String what) {
        List<Entry> out = new ArrayList<>();
        if (!(node instanceof MappingNode m)) {
            problem(what + " must be a mapping of keys to values");
            return out;
        }
        Set<String> seen = new HashSet<>();
        for (NodeTuple t : m.getValue()) {
            if (!(t.getKeyNode() instanceof ScalarNode k)) {
                problems.add(at(t.getKeyNode(), "keys in " + what + " must be plain words"));
                continue;
            }
            if (!seen.add(k.getValue())) {
                problems.add(at(k, "key " + Excerpt.quoted(k.getValue()) + " appears twice in " + what));
                continue;
            }
            out.add(new Entry(k.getValue(), new YamlNode(file, k, problems), new YamlNode(file, t.getValueNode(), problems)));
        }
        return out;
    }

    /** The items of a sequence; a problem (and no items) if this is not a sequence. */
    List<YamlNode> sequence(String what) {
        List<YamlNode> out = new ArrayList<>();
        if (!(node instanceof SequenceNode s)) {
            problem(what + " must be a list");
            return out;
        }
        for (Node item : s.getValue()) {
            out.add(new YamlNode(file, item, problems));
        }
        return out;
    }

    /**
     * A plain string; null (with a problem) for anything else. Control characters other than tab
     * and line breaks (which only escapes such as {@code "\0"} can write) are refused: names and
     * messages reach the journal, whose PostgreSQL text columns cannot hold NUL.
     */
    String string(String what) {
        if (node instanceof ScalarNode s && !Tag.NULL.equals(s.getTag()) && !s.getValue().isBlank()) {
            String value = s.getValue();
            for (int i = 0; i < value.length(); i++) {
                char c = value.charAt(i);
                if (Character.isISOControl(c) && c != '\t' && c != '\n' && c != '\r') {
                    problem(String.format("%s contains the control character U+%04X", what, (int) c));
                    return null;
                }
            }
            return value;
        }
        problem(what + " must be a non-empty text value");
        return null;
    }

    /** A finite number; NaN (with a problem) for anything else, including .inf, .nan and overflow. */
    double number(String what) {
        if (node instanceof ScalarNode s) {
            return number(what, s.getTag(), s.getValue(), this::problem);
        }
        problem(what + " must be a number, got " + describe());
        return Double.NaN;
    }

    /**
     * A scalar's value as a finite number, read as {@link #number(String)} reads a node's: NaN (with
     * a problem) for anything else. For text that arrives outside a YAML file, such as a command
     * line's {@code share-inverted:90:0.8}, with the tag from {@link #resolve}, so that both agree.
     */
    static double number(String what, Tag tag, String value, Consumer<String> problem) {
        if (Tag.INT.equals(tag) || Tag.FLOAT.equals(tag)) {
            if (NON_FINITE.matcher(value).matches()) {
                problem.accept(what + " must be a finite number, got " + Excerpt.quoted(value));
                return Double.NaN;
            }
            try {
                double v = Double.parseDouble(value);
                if (Double.isFinite(v)) {
                    return v;
                }
                problem.accept(what + " must be a finite number, got " + Excerpt.quoted(value));
                return Double.NaN;
            } catch (NumberFormatException ignored) {
                // reported below
            }
        }
        problem.accept(what + " must be a number, got " + Excerpt.quoted(value));
        return Double.NaN;
    }

    /** The tag the policy reader gives a plain (unquoted) scalar of this text: int, float, str and so on. */
    static Tag resolve(String plain) {
        return RESOLVER.resolve(plain, true);
    }

    /** True for a scalar written as a whole number. */
    boolean isScalarInteger() {
        return node instanceof ScalarNode s && Tag.INT.equals(s.getTag());
    }

    /** true or false; null (with a problem) for anything else. */
    Boolean bool(String what) {
        if (node instanceof ScalarNode s && Tag.BOOL.equals(s.getTag())) {
            return Boolean.parseBoolean(s.getValue());
        }
        problem(what + " must be true or false, got " + describe());
        return null;
    }

    /** A whole number; {@code Integer.MIN_VALUE} (with a problem) for anything else. */
    int integer(String what) {
        if (node instanceof ScalarNode s) {
            return integer(what, s.getTag(), s.getValue(), this::problem);
        }
        problem(what + " must be a whole number, got " + describe());
        return Integer.MIN_VALUE;
    }

    /** A scalar's value as a whole number, read as {@link #integer(String)} reads a node's (see {@link #number(String, Tag, String, Consumer)}). */
    static int integer(String what, Tag tag, String value, Consumer<String> problem) {
        if (Tag.INT.equals(tag)) {
            try {
                return Integer.parseInt(value);
            } catch (NumberFormatException ignored) {
                // reported below
            }
        }
        problem.accept(what + " must be a whole number, got " + Excerpt.quoted(value));
        return Integer.MIN_VALUE;
    }

    private String describe() {
        if (node instanceof ScalarNode s) {
            return Excerpt.quoted(s.getValue());
        }
        return node instanceof SequenceNode ? "a list" : "a mapping";
    }
}
