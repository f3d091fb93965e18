package org.slopewatch.rules;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.Observation;
import org.slopewatch.monitor.PersistenceTest;
import org.slopewatch.monitor.Watch;
import org.slopewatch.spread.SpreadDefinition;
import org.slopewatch.text.Excerpt;
import org.snakeyaml.engine.v2.api.LoadSettings;
import org.snakeyaml.engine.v2.composer.Composer;
import org.snakeyaml.engine.v2.exceptions.Mark;
import org.snakeyaml.engine.v2.exceptions.MarkedYamlEngineException;
import org.snakeyaml.engine.v2.exceptions.ReaderException;
import org.snakeyaml.engine.v2.exceptions.YamlEngineException;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.parser.ParserImpl;
import org.snakeyaml.engine.v2.scanner.StreamReader;

/**
 * Reads a policy file: YAML with keys of our own (documented in {@code alert-rules/README.md}).
 * Every problem is reported with {@code file:line:column}, all of them in one go.
 *
 * <p>The YAML is composed into nodes and never constructed into objects, so tags name no class
 * and nothing is looked up or evaluated: {@code ${…}}, {@code !include} and the like stay text.
 * Hostile files end fast with a problem: more than {@link #MAX_CODE_POINTS} code points, more than
 * {@link #MAX_ALIASES} aliases of lists and mappings (an alias bomb), aliases that expand the
 * document past {@link #MAX_EXPANDED} nodes and characters ({@link ExpansionLimit}: thousands of
 * aliases of one long text), or nesting deeper than {@link #MAX_DEPTH} ({@link NestingLimit}: it
 * would otherwise overflow the composer's stack). Values quoted in problems are excerpts
 * ({@link Excerpt}), and at most {@link Problems#MAX_LISTED} problems are listed.
 */
public final class PolicyParser {

    /** About 300 times the shipped policy; a longer file is not a policy anyone reviews. */
    static final int MAX_CODE_POINTS = 1 << 20;
    static final int MAX_ALIASES = 50;
    /** The shipped policy nests six levels deep. */
    static final int MAX_DEPTH = 64;
    /**
     * Nodes plus scalar characters with every alias counted as a copy ({@link ExpansionLimit}); a
     * file without aliases stays about as large as its text, which {@link #MAX_CODE_POINTS} bounds.
     */
    static final long MAX_EXPANDED = MAX_CODE_POINTS;

    static final Set<String> TOP_KEYS = ordered("watch", "probability", "channels", "alerts");
    static final Set<String> WATCH_KEYS = ordered("spread", "curves", "enter-below-bp", "exit-at-or-above-bp",
            "exit-after-observations", "hold-days", "confirm");

    private static final int DEFAULT_HOLD_DAYS = 365;

    private PolicyParser() {
    }

    /**
     * Parses a policy file's bytes as every reader of policies does (the daemon, {@code vet-policy},
     * replay and what-if): UTF-8, a byte that is not UTF-8 read as U+FFFD, so that all of them
     * agree on whether a file is valid.
     */
    public static Policy parse(String file, byte[] bytes) throws PolicyException {
        return parse(file, new String(bytes, StandardCharsets.UTF_8));
    }

    /** Parses one policy file's text; {@code file} names it in messages. */
    public static Policy parse(String file, String text) throws PolicyException {
        Problems problems = new Problems();
        if (text.length() > MAX_CODE_POINTS && text.codePointCount(0, text.length()) > MAX_CODE_POINTS) {
            throw new PolicyException(List.of(new PolicyProblem(file, 1, 1, "the policy is " + text.codePointCount(0, text.length())
                    + " characters long; at most " + MAX_CODE_POINTS)));
        }
        // A buffer that holds the whole text: snakeyaml-engine 2.10 reads past its buffer (an
        // IndexOutOfBoundsException) when a surrogate pair, such as an emoji, straddles a buffer's end.
        LoadSettings settings = LoadSettings.builder().setLabel(file).setCodePointLimit(MAX_CODE_POINTS)
                .setMaxAliasesForCollections(MAX_ALIASES).setAllowRecursiveKeys(false).setBufferSize(text.length() + 1).build();
        Optional<Node> root;
        try {
            root = new Composer(settings, new ExpansionLimit(new NestingLimit(new ParserImpl(settings, new StreamReader(settings, text)),
                    MAX_DEPTH), MAX_EXPANDED)).getSingleNode();
        } catch (ComposeLimit e) {
            throw new PolicyException(List.of(new PolicyProblem(file, e.mark.map(x -> x.getLine() + 1).orElse(1),
                    e.mark.map(x -> x.getColumn() + 1).orElse(1), e.getMessage())));
        } catch (MarkedYamlEngineException e) {
            // the YAML reader's messages may quote the text (an undefined alias, for one), hence the excerpt
            Optional<Mark> m = e.getProblemMark().or(e::getContextMark);
            throw new PolicyException(List.of(new PolicyProblem(file, m.map(x -> x.getLine() + 1).orElse(1),
                    m.map(x -> x.getColumn() + 1).orElse(1), "not valid YAML: " + Excerpt.of(e.getProblem()))));
        } catch (ReaderException e) {
            throw new PolicyException(List.of(at(file, text, e.getPosition(), String.format("not valid YAML: %s (U+%04X)",
                    Excerpt.of(e.getMessage()), e.getCodePoint()))));
        } catch (YamlEngineException e) {
            throw new PolicyException(List.of(new PolicyProblem(file, 1, 1, "not valid YAML: " + Excerpt.of(e.getMessage()))));
        } catch (RuntimeException e) {
            // a failure inside the YAML library is still an answer about this file, not a crash of the caller
            throw new PolicyException(List.of(new PolicyProblem(file, 1, 1, "not valid YAML: the YAML reader failed on this text ("
                    + e.getClass().getSimpleName() + ": " + Excerpt.of(e.getMessage()) + ")")));
        }
        if (root.isEmpty()) {
            throw new PolicyException(List.of(new PolicyProblem(file, 1, 1, "empty policy: expected a 'watch' list")));
        }
        Map<String, YamlNode> top = new YamlNode(file, root.get(), problems).mapping("the policy", TOP_KEYS);
        List<Watch> watches = new ArrayList<>();
        YamlNode watchNode = top.get("watch");
        if (watchNode == null) {
            if (problems.isEmpty()) {
                problems.add(new PolicyProblem(file, 1, 1, "missing 'watch': the list of spreads to watch"));
            }
        } else {
            for (YamlNode item : watchNode.sequence("'watch'")) {
                Watch w = watch(item);
                if (w != null) {
                    watches.add(w);
                }
            }
            if (watches.isEmpty() && problems.isEmpty()) {
                watchNode.problem("'watch' lists no spread");
            }
        }
        Set<String> spreadNames = new LinkedHashSet<>();
        watches.forEach(w -> spreadNames.add(w.spread().name()));
        ProbabilityModels models = ProbabilitySectionParser.models(top.get("probability"), spreadNames);
        Map<String, ChannelDeclaration> channels = AlertSectionParser.channels(top.get("channels"));
        List<AlertRule> alerts = AlertSectionParser.alerts(top.get("alerts"), spreadNames, channels.keySet(), models.spreads());
        if (!problems.isEmpty()) {
            throw problems.exception();
        }
        return new Policy(file, watches, List.copyOf(channels.values()), alerts, models, problems.warnings());
    }

    /** The problem at a code point's position in the text, which is all the YAML reader gives for a character it refuses. */
    private static PolicyProblem at(String file, String text, int codePointIndex, String message) {
        int line = 1;
        int column = 1;
        int end = text.offsetByCodePoints(0, Math.min(Math.max(codePointIndex, 0), text.codePointCount(0, text.length())));
        for (int i = 0; i < end; i++) {
            if (text.charAt(i) == '\n') {
                line++;
                column = 1;
            } else if (!Character.isLowSurrogate(text.charAt(i))) {
                column++;
            }
        }
        return new PolicyProblem(file, line, column, message);
    }

    private static Watch watch(YamlNode item) {
        Map<String, YamlNode> keys = item.mapping("a watch entry", WATCH_KEYS);
        if (!item.isMapping()) {
            return null;
        }
        SpreadDefinition spread = null;
        YamlNode spreadNode = keys.get("spread");
        if (spreadNode == null) {
            item.problem("a watch entry needs 'spread' (for example 10Y-3M)");
        } else {
            String name = spreadNode.string("'spread'");
            if (name != null) {
                try {
                    spread = SpreadDefinition.parse(name);
                } catch (IllegalArgumentException e) {
                    spreadNode.problem(e.getMessage());
                }
            }
        }
        Set<String> curves = new LinkedHashSet<>();
        if (keys.containsKey("curves")) {
            for (YamlNode c : keys.get("curves").sequence("'curves'")) {
                String name = c.string("a curve name");
                if (name != null) {
                    curves.add(name);
                }
            }
        }
        double entry = keys.containsKey("enter-below-bp") ? threshold(keys.get("enter-below-bp"), "'enter-below-bp'") : 0;
        double exit = keys.containsKey("exit-at-or-above-bp") ? threshold(keys.get("exit-at-or-above-bp"), "'exit-at-or-above-bp'") : entry;
        int exitAfter = keys.containsKey("exit-after-observations")
                ? keys.get("exit-after-observations").integer("'exit-after-observations'") : 1;
        int hold = keys.containsKey("hold-days") ? keys.get("hold-days").integer("'hold-days'") : DEFAULT_HOLD_DAYS;
        if (exit < entry) {
            keys.get("exit-at-or-above-bp").problem("impossible thresholds: exit-at-or-above-bp (" + exit
                    + ") is below enter-below-bp (" + entry + "); a spell could never end");
        }
        if (exitAfter != Integer.MIN_VALUE && exitAfter < 1) {
            keys.get("exit-after-observations").problem("'exit-after-observations' must be at least 1, got " + exitAfter);
        }
        if (hold != Integer.MIN_VALUE && hold < 0) {
            keys.get("hold-days").problem("'hold-days' must not be negative, got " + hold);
        }
        List<PersistenceTest> tests = new ArrayList<>();
        YamlNode confirm = keys.get("confirm");
        if (confirm == null) {
            item.problem("a watch entry needs 'confirm': at least one persistence test ("
                    + PersistenceForms.TEXT_FORMS + ")");
        } else {
            for (YamlNode t : confirm.sequence("'confirm'")) {
                PersistenceTest test = test(t, entry);
                if (test != null) {
                    tests.add(test);
                }
            }
        }
        try {
            if (spread == null || tests.isEmpty()) {
                return null;
            }
            return new Watch(spread, new MonitorDefinition(entry, exit, exitAfter, hold, tests), curves);
        } catch (IllegalArgumentException e) {
            // any remaining inconsistency was already reported at its key, or is reported here
            item.problem(e.getMessage());
            return null;
        }
    }

    /**
     * A threshold in bp as read, or NaN after a problem at its key when it is larger than the monitor
     * compares ({@link Observation#MAX_MAGNITUDE_BP}): NaN, as for a value that is not a number, stops
     * what rests on it without a second problem.
     */
    private static double threshold(YamlNode node, String what) {
        double v = node.number(what);
        if (!Double.isNaN(v) && !(Math.abs(v) < Observation.MAX_MAGNITUDE_BP)) {
            node.problem(what + " must be at most " + (long) Observation.MAX_MAGNITUDE_BP + " bp in size, got " + v);
            return Double.NaN;
        }
        return v;
    }

    /**
     * One confirm item: text such as {@code quarter-average} or {@code days-inverted:90}, or a one-key
     * mapping of a test's name to its parameters; both read by {@link PersistenceForms}, as the
     * command line's {@code --persistence} is.
     */
    private static PersistenceTest test(YamlNode t, double entry) {
        if (!t.isMapping()) {
            String text = t.string("a confirm item");
            return text == null ? null : PersistenceForms.read(text, entry, t::problem);
        }
        List<YamlNode.Entry> one = t.entries("a confirm item");
        if (one.size() != 1) {
            if (one.size() > 1) {
                t.problem("a confirm item names one test; write one item per test");
            }
            return null;
        }
        String name = one.get(0).key();
        if (!PersistenceForms.NAMES.contains(name)) {
            one.get(0).keyNode().problem(PersistenceForms.unknown(name));
            return null;
        }
        YamlNode params = one.get(0).value();
        Map<String, YamlNode> given = params.isNull() ? Map.of() : params.mapping("'" + name + "'", PersistenceForms.keys(name));
        Map<PersistenceForms.Parameter, Number> values = new EnumMap<>(PersistenceForms.Parameter.class);
        Map<PersistenceForms.Parameter, YamlNode> written = new EnumMap<>(PersistenceForms.Parameter.class);
        for (PersistenceForms.Parameter p : PersistenceForms.Parameter.values()) {
            YamlNode n = given.get(p.key);
            if (n == null) {
                continue;
            }
            written.put(p, n);
            String what = "'" + p.key + "'";
            if (p == PersistenceForms.Parameter.DAYS) {
                int v = n.integer(what);
                if (v != Integer.MIN_VALUE) {
                    values.put(p, v);
                }
            } else {
                double v = n.number(what);
                if (!Double.isNaN(v)) {
                    values.put(p, v);
                }
            }
        }
        return PersistenceForms.build(name, values, written.keySet(), entry, (at, message) -> (at == null ? t : written.get(at)).problem(message));
    }

    private static Set<String> ordered(String... keys) {
        return new LinkedHashSet<>(List.of(keys));
    }
}
