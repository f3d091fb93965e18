package org.slopewatch.rules;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Turns conditions into notices: an opening notice when a condition starts to hold, standing
 * notices at the rule's interval while it holds, and a closing notice when it stops (if the rule
 * asks for one).
 * The decision is a pure function of the conditions, the time passed in and the state kept here,
 * which is small and can be rebuilt from the journal's alerts.
 */
public final class AlertEngine {

    /** What the engine remembers of one rule and subject while its condition holds. */
    public record Episode(LocalDate since, Instant lastNotice, int notices) {
    }

    private static final Pattern PLACEHOLDER = Pattern.compile("\\{([a-z]+)}");

    private final Map<String, AlertRule> rules = new HashMap<>();
    private final Map<String, Episode> open = new HashMap<>();

    public AlertEngine(List<AlertRule> rules) {
        rules.forEach(r -> this.rules.put(r.name(), r));
    }

    /** The open episodes by rule and subject ({@code rule|subject}), for inspection and tests. */
    public Map<String, Episode> openEpisodes() {
        return Map.copyOf(open);
    }

    /**
     * Decides, for each condition, whether a notice is due now.
     *
     * @param now the wall-clock time the decision is made at (standing intervals are wall-clock time)
     */
    public List<AlertDecision> decide(List<AlertCondition> conditions, Instant now) {
        List<AlertDecision> out = new ArrayList<>();
        for (AlertCondition c : conditions) {
            AlertRule rule = rules.get(c.rule());
            if (rule == null) {
                continue;
            }
            String key = c.rule() + "|" + c.subject();
            Episode episode = open.get(key);
            if (c.holds() && episode == null) {
                open.put(key, new Episode(c.since(), now, 1));
                out.add(decision(rule, c, c.since(), Alert.Kind.OPENING, 1, "the condition now holds"));
            } else if (c.holds() && !rule.standingEvery().isZero()
                    && Duration.between(episode.lastNotice(), now).compareTo(rule.standingEvery()) >= 0) {
                int n = episode.notices() + 1;
                open.put(key, new Episode(episode.since(), now, n));
                out.add(decision(rule, c, episode.since(), Alert.Kind.STANDING, n, "standing interval of " + rule.standingEvery() + " elapsed"));
            } else if (!c.holds() && episode != null) {
                open.remove(key);
                if (rule.closingNotice()) {
                    out.add(decision(rule, c, episode.since(), Alert.Kind.CLOSING, episode.notices() + 1, "the condition no longer holds"));
                }
            }
        }
        return out;
    }

    /** Forgets an episode's standing schedule, e.g. after an acknowledgement: no more standing notices, still a closing notice. */
    public void silence(String rule, String subject) {
        open.computeIfPresent(rule + "|" + subject, (k, e) -> new Episode(e.since(), Instant.MAX, e.notices()));
    }

    private static AlertDecision decision(AlertRule rule, AlertCondition c, LocalDate since, Alert.Kind notice, int n,
                                          String why) {
        String id = id(rule.name(), c.subject(), since, n);
        return new AlertDecision(id, rule, c.subject(), since, n, notice, why, fill(rule.message(), rule, c), c);
    }

    /**
     * The deterministic id of a notice: rule, subject, episode start and notice number joined by
     * {@code ~}, which appears in none of them and, unlike {@code /}, needs no escaping in a URL path.
     */
    public static String id(String rule, String subject, LocalDate since, int notice) {
        return rule + "~" + subject + "~" + since + "~" + notice;
    }

    /** Puts back an episode read from the journal (after a restart), so that standing and closing notices continue. */
    public void restore(String rule, String subject, Episode episode) {
        open.put(rule + "|" + subject, episode);
    }

    /**
     * An engine with new rules that keeps the open episodes of rules still present by name, so
     * that reloading a policy neither sends a second opening notice nor forgets a closing one.
     */
    public AlertEngine withRules(List<AlertRule> newRules) {
        AlertEngine next = new AlertEngine(newRules);
        open.forEach((key, episode) -> {
            if (next.rules.containsKey(key.substring(0, key.indexOf('|')))) {
                next.open.put(key, episode);
            }
        });
        return next;
    }

    static String fill(String template, AlertRule rule, AlertCondition c) {
        Matcher m = PLACEHOLDER.matcher(template);
        StringBuilder b = new StringBuilder();
        Map<String, String> values = c.values(); // built on asking: once per message, not per placeholder
        while (m.find()) {
            String key = m.group(1);
            String value = switch (key) {
                case "rule" -> rule.name();
                case "severity" -> rule.severity().name();
                default -> values.getOrDefault(key, "?");
            };
            m.appendReplacement(b, Matcher.quoteReplacement(value));
        }
        m.appendTail(b);
        return b.toString();
    }
}
