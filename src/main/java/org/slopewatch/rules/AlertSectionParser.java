package org.slopewatch.rules;

import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.text.Excerpt;
import org.slopewatch.text.FieldText;

/** Reads the alerting part of a policy: {@code channels} and {@code alerts}. Problems go to the shared list. */
final class AlertSectionParser {

    static final Set<String> RULE_KEYS = ordered("name", "when", "spreads", "severity", "channels", "standing-every", "closing-notice",
            "message");
    static final Set<String> TRIGGER_KEYS = ordered("enters-state", "inverted-for-days", "probability-above", "feed-stale", "spread-below-bp");
    static final Set<String> CHANNEL_KEYS = ordered("type");
    /** The long form of {@code probability-above}: {@code { level: 0.5, month: to-date }}. */
    static final Set<String> PROBABILITY_ABOVE_KEYS = ordered("level", "month");
    static final Set<String> PLACEHOLDERS = Set.of("curve", "spread", "state", "value", "reason", "days", "date", "rule", "severity");

    private static final Pattern DURATION = Pattern.compile("(\\d+)\\s*([smhd])");
    private static final Pattern PLACEHOLDER = Pattern.compile("\\{([^{}]*)}");

    /** Rule and channel names go into the journal's {@code alert.rule} and {@code delivery.channel}, 100 characters each. */
    static final int MAX_NAME = 100;

    private AlertSectionParser() {
    }

    /** The declared channels, with {@code log} always present. */
    static Map<String, ChannelDeclaration> channels(YamlNode node) {
        Map<String, ChannelDeclaration> out = new LinkedHashMap<>();
        out.put(ChannelDeclaration.LOG.name(), ChannelDeclaration.LOG);
        if (node == null) {
            return out;
        }
        Set<String> anyName = new NameSet();
        for (Map.Entry<String, YamlNode> e : node.mapping("'channels'", anyName).entrySet()) {
            Map<String, YamlNode> keys = e.getValue().mapping("channel " + Excerpt.quoted(e.getKey()), CHANNEL_KEYS);
            YamlNode typeNode = keys.get("type");
            if (typeNode == null) {
                if (e.getValue().isMapping()) {
                    e.getValue().problem("channel " + Excerpt.quoted(e.getKey()) + " needs 'type' (one of " + String.join(", ", ChannelDeclaration.TYPES) + ")");
                }
                continue;
            }
            String type = typeNode.string("'type'");
            if (type != null && !ChannelDeclaration.TYPES.contains(type)) {
                typeNode.problem("unknown channel type " + Excerpt.quoted(type) + " for channel " + Excerpt.quoted(e.getKey()) + " (known: "
                        + String.join(", ", ChannelDeclaration.TYPES) + ")");
            } else if (type != null && name(e.getValue(), "channel name", e.getKey()) != null) {
                out.put(e.getKey(), new ChannelDeclaration(e.getKey(), type));
            }
        }
        return out;
    }

    /** The name if the journal can keep it (and a log line repeat it), else null with a problem at {@code node}. */
    private static String name(YamlNode node, String what, String name) {
        String problem = FieldText.problem(what, name, MAX_NAME);
        if (problem != null) {
            node.problem(problem);
            return null;
        }
        return name;
    }

    /**
     * @param modelled spreads with a probability model: the only ones a {@code probability-above}
     *                 rule may apply to
     */
    static List<AlertRule> alerts(YamlNode node, Set<String> spreadNames, Set<String> channelNames, Set<String> modelled) {
        List<AlertRule> out = new ArrayList<>();
        if (node == null) {
            return out;
        }
        Set<String> names = new LinkedHashSet<>();
        for (YamlNode item : node.sequence("'alerts'")) {
            AlertRule rule = rule(item, spreadNames, channelNames, modelled);
            if (rule != null) {
                if (!names.add(rule.name())) {
                    item.problem("alert rule name " + Excerpt.quoted(rule.name()) + " is used twice");
                } else {
                    out.add(rule);
                }
            }
        }
        return out;
    }

    private static AlertRule rule(YamlNode item, Set<String> spreadNames, Set<String> channelNames, Set<String> modelled) {
        Map<String, YamlNode> keys = item.mapping("an alert rule", RULE_KEYS, DeprecatedNames.RULE_KEYS, DeprecatedNames::keyWarning);
        if (!item.isMapping()) {
            return null;
        }
        String name = required(keys, "name", item, "an alert rule needs 'name'") == null ? null
                : name(keys.get("name"), "name", keys.get("name").string("'name'"));
        AlertTrigger when = keys.containsKey("when") ? trigger(keys.get("when")) : missing(item, "an alert rule needs 'when' (one of "
                + String.join(", ", TRIGGER_KEYS) + ")");
        Set<String> spreads = new LinkedHashSet<>();
        if (keys.containsKey("spreads")) {
            for (YamlNode s : keys.get("spreads").sequence("'spreads'")) {
                String spread = s.string("a spread name");
                if (spread != null && !spreadNames.contains(spread)) {
                    s.problem("unknown spread " + Excerpt.quoted(spread) + ": not watched by this policy (watched: " + String.join(", ", spreadNames) + ")");
                } else if (spread != null && when instanceof AlertTrigger.ProbabilityAbove && !modelled.contains(spread)) {
                    s.problem("'probability-above' needs a probability model for spread " + Excerpt.quoted(spread) + ": add one under"
                            + " 'probability' (models: " + names(modelled) + ")");
                } else if (spread != null) {
                    spreads.add(spread);
                }
            }
        } else if (when instanceof AlertTrigger.ProbabilityAbove) {
            // no 'spreads' means every watched spread, and each of them needs a model
            List<String> without = spreadNames.stream().filter(n -> !modelled.contains(n)).toList();
            if (!without.isEmpty()) {
                keys.get("when").problem("'probability-above' applies to every watched spread, but " + String.join(", ", without)
                        + " ha" + (without.size() == 1 ? "s" : "ve") + " no probability model: list 'spreads' or add models under"
                        + " 'probability' (models: " + names(modelled) + ")");
                when = null;
            }
        }
        Severity severity = null;
        YamlNode sev = required(keys, "severity", item, "an alert rule needs 'severity' (info, warning or critical)");
        if (sev != null) {
            String text = sev.string("'severity'");
            try {
                severity = text == null ? null : Severity.valueOf(text.toUpperCase(Locale.ROOT));
            } catch (IllegalArgumentException e) {
                sev.problem("unknown severity " + Excerpt.quoted(text) + " (known: info, warning, critical)");
            }
        }
        List<String> channels = new ArrayList<>();
        YamlNode ch = required(keys, "channels", item, "an alert rule needs 'channels' (for example [log])");
        if (ch != null) {
            List<YamlNode> listed = ch.sequence("'channels'");
            for (YamlNode c : listed) {
                String channel = c.string("a channel name");
                if (channel != null && !channelNames.contains(channel)) {
                    c.problem("unknown channel " + Excerpt.quoted(channel) + " (declared: " + String.join(", ", channelNames) + ")");
                } else if (channel != null) {
                    channels.add(channel);
                }
            }
            if (listed.isEmpty() && ch.isSequence()) {
                ch.problem("'channels' lists no channel");
            }
        }
        Duration standing = keys.containsKey("standing-every") ? duration(keys.get("standing-every")) : Duration.ZERO;
        boolean closing = keys.containsKey("closing-notice") && bool(keys.get("closing-notice"), "'closing-notice'");
        String message = keys.containsKey("message") ? template(keys.get("message")) : "{rule}: {curve} {spread} {state} on {date}: {reason}";
        if (name == null || when == null || severity == null || channels.isEmpty() || standing == null || message == null) {
            return null;
        }
        return new AlertRule(name, when, spreads, severity, channels, standing, closing, message);
    }

    private static AlertTrigger trigger(YamlNode when) {
        Map<String, YamlNode> one = when.mapping("'when'", TRIGGER_KEYS);
        if (one.size() != 1) {
            if (when.isMapping()) {
                when.problem("'when' takes exactly one condition (one of " + String.join(", ", TRIGGER_KEYS) + "), found " + one.size());
            }
            return null;
        }
        Map.Entry<String, YamlNode> e = one.entrySet().iterator().next();
        YamlNode v = e.getValue();
        switch (e.getKey()) {
            case "enters-state" -> {
                String state = v.string("'enters-state'");
                try {
                    return state == null ? null : new AlertTrigger.EntersState(SpreadState.valueOf(state.toUpperCase(Locale.ROOT)));
                } catch (IllegalArgumentException ex) {
                    v.problem("unknown state " + Excerpt.quoted(state) + " (known: NORMAL, INVERTED, CONFIRMED, RESTEEPENING)");
                    return null;
                }
            }
            case "inverted-for-days" -> {
                int days = v.integer("'inverted-for-days'");
                if (days != Integer.MIN_VALUE && days < 1) {
                    v.problem("impossible threshold: 'inverted-for-days' must be at least 1, got " + days);
                    return null;
                }
                return days == Integer.MIN_VALUE ? null : new AlertTrigger.InvertedForDays(days);
            }
            case "probability-above" -> {
                return probabilityAbove(v);
            }
            case "feed-stale" -> {
                if (!bool(v, "'feed-stale'")) {
                    v.problem("'feed-stale' can only be true (leave the rule out to switch it off)");
                    return null;
                }
                return new AlertTrigger.FeedStale();
            }
            default -> {
                double bp = v.number("'spread-below-bp'");
                return Double.isNaN(bp) ? null : new AlertTrigger.SpreadBelow(bp);
            }
        }
    }

    /** {@code probability-above: 0.5}, or {@code { level: 0.5, month: complete | to-date }}; the last complete month by default. */
    private static AlertTrigger probabilityAbove(YamlNode v) {
        YamlNode levelNode = v;
        ProbabilityMonth month = ProbabilityMonth.COMPLETE;
        if (v.isMapping()) {
            Map<String, YamlNode> keys = v.mapping("'probability-above'", PROBABILITY_ABOVE_KEYS);
            levelNode = keys.get("level");
            if (levelNode == null) {
                v.problem("'probability-above' needs 'level' (a probability between 0 and 1)");
            }
            YamlNode monthNode = keys.get("month");
            if (monthNode != null) {
                String text = monthNode.string("'month'");
                month = text == null ? null : ProbabilityMonth.of(text);
                if (text != null && month == null) {
                    monthNode.problem("unknown month " + Excerpt.quoted(text) + " for 'probability-above' (known: "
                            + ProbabilityMonth.COMPLETE.key() + ", the default, and " + ProbabilityMonth.TO_DATE.key() + ")");
                }
            }
            if (levelNode == null || month == null) {
                return null;
            }
        }
        double level = levelNode.number("'probability-above'");
        if (!Double.isNaN(level) && !(level > 0 && level < 1)) {
            levelNode.problem("impossible threshold: 'probability-above' is a probability between 0 and 1 (exclusive), got " + level);
            return null;
        }
        return Double.isNaN(level) ? null : new AlertTrigger.ProbabilityAbove(level, month);
    }

    private static Duration duration(YamlNode node) {
        if (node.isScalarInteger()) {
            int n = node.integer("'standing-every'");
            if (n == 0) {
                return Duration.ZERO;
            }
        }
        String text = node.string("'standing-every'");
        if (text == null) {
            return null;
        }
        Matcher m = DURATION.matcher(text.strip());
        if (!m.matches()) {
            node.problem("'standing-every' must be a duration such as 30s, 30m, 4h or 1d (0 for never), got " + Excerpt.quoted(text));
            return null;
        }
        try {
            long n = Long.parseLong(m.group(1));
            return switch (m.group(2)) {
                case "s" -> Duration.ofSeconds(n);
                case "m" -> Duration.ofMinutes(n);
                case "h" -> Duration.ofHours(n);
                default -> Duration.ofDays(n);
            };
        } catch (ArithmeticException | NumberFormatException e) {
            node.problem("'standing-every' is too long to be a duration, got " + Excerpt.quoted(text));
            return null;
        }
    }

    private static String template(YamlNode node) {
        String text = node.string("'message'");
        if (text == null) {
            return null;
        }
        Matcher m = PLACEHOLDER.matcher(text);
        while (m.find()) {
            if (!PLACEHOLDERS.contains(m.group(1))) {
                node.problem("unknown placeholder {" + m.group(1) + "} in 'message' (known: " + String.join(", ", new java.util.TreeSet<>(PLACEHOLDERS)) + ")");
                return null;
            }
        }
        return text;
    }

    private static boolean bool(YamlNode node, String what) {
        Boolean b = node.bool(what);
        return b != null && b;
    }

    private static YamlNode required(Map<String, YamlNode> keys, String key, YamlNode item, String message) {
        YamlNode n = keys.get(key);
        if (n == null) {
            item.problem(message);
        }
        return n;
    }

    private static <T> T missing(YamlNode item, String message) {
        item.problem(message);
        return null;
    }

    private static String names(Set<String> names) {
        return names.isEmpty() ? "none" : String.join(", ", names);
    }

    private static Set<String> ordered(String... keys) {
        return new LinkedHashSet<>(List.of(keys));
    }

    /** Channel names are the user's own: any key is allowed. */
    private static final class NameSet extends LinkedHashSet<String> {
        @Override
        public boolean contains(Object o) {
            return o instanceof String s && !s.isBlank();
        }
    }
}
