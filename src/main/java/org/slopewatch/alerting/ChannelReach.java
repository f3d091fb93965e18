package org.slopewatch.alerting;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Function;
import org.slopewatch.rules.AlertRule;
import org.slopewatch.rules.ChannelDeclaration;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.Severity;

/**
 * Whether the policy's alert rules can reach the desk with the channels configured here: the
 * channels the policy names that are not configured (their deliveries are journalled as skipped),
 * and per rule the configured channels that carry its notices to someone. A rule reaches the desk
 * when at least one of its channels is configured; a {@link Severity#CRITICAL} rule needs one that
 * is not a {@code log} channel, because a line in the daemon's log is read by no one in time.
 *
 * <p>The one place for this rule: {@link AlertDesk} warns from it at start-up and on reload, and
 * the wellness check reports it.
 */
public record ChannelReach(String source, List<ChannelDeclaration> unconfigured, List<RuleReach> rules) {

    /**
     * One rule's reach.
     *
     * @param delivering   the configured channels that count for this rule, in the policy's order
     * @param unconfigured the channels it names that are not configured
     * @param logOnly      configured channels that do not count for it (log channels of a critical rule)
     */
    public record RuleReach(String rule, Severity severity, List<String> delivering, List<String> unconfigured, List<String> logOnly) {

        public RuleReach {
            delivering = List.copyOf(delivering);
            unconfigured = List.copyOf(unconfigured);
            logOnly = List.copyOf(logOnly);
        }

        public boolean reaches() {
            return !delivering.isEmpty();
        }

        /** A line a person reads: what carries the rule's notices, or why nothing does. */
        public String describe() {
            String missing = unconfigured.isEmpty() ? "" : "; not configured: " + String.join(", ", unconfigured);
            if (reaches()) {
                return "reaches the desk on " + String.join(", ", delivering) + missing;
            }
            if (logOnly.isEmpty()) {
                return "cannot reach the desk: none of its channels is configured (" + String.join(", ", unconfigured) + ")";
            }
            return "cannot reach the desk: only " + String.join(", ", logOnly) + " remains, a log no one reads in time for a critical "
                    + "notice" + missing;
        }
    }

    public ChannelReach {
        unconfigured = List.copyOf(unconfigured);
        rules = List.copyOf(rules);
    }

    /** The rule itself, on a lookup of each channel's configured type (empty: not configured). */
    static ChannelReach of(Policy policy, Function<String, Optional<String>> configuredType) {
        List<ChannelDeclaration> unconfigured = new ArrayList<>();
        for (ChannelDeclaration declared : policy.channels()) {
            if (configuredType.apply(declared.name()).isEmpty()) {
                unconfigured.add(declared);
            }
        }
        List<RuleReach> rules = new ArrayList<>();
        for (AlertRule rule : policy.alerts()) {
            List<String> delivering = new ArrayList<>();
            List<String> missing = new ArrayList<>();
            List<String> logOnly = new ArrayList<>();
            for (String channel : rule.channels()) {
                Optional<String> type = configuredType.apply(channel);
                if (type.isEmpty()) {
                    missing.add(channel);
                } else if (rule.severity() == Severity.CRITICAL && ChannelDeclaration.LOG.type().equals(type.get())) {
                    logOnly.add(channel);
                } else {
                    delivering.add(channel);
                }
            }
            rules.add(new RuleReach(rule.name(), rule.severity(), delivering, missing, logOnly));
        }
        return new ChannelReach(policy.source(), unconfigured, rules);
    }

    /** The rules that cannot reach the desk. */
    public List<RuleReach> unreached() {
        return rules.stream().filter(r -> !r.reaches()).toList();
    }
}
