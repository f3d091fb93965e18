package org.slopewatch.rules;

import java.util.List;
import org.slopewatch.monitor.Watch;

/**
 * A desk's signed-off policy: the spreads it watches, how an inversion is confirmed, the
 * recession-probability models it accepts, and who hears about it (channels and alert rules).
 *
 * @param source      where it was read from, for messages
 * @param probability the probit models by spread; every {@code probability-above} rule refers
 *                    only to spreads that have one
 * @param warnings    what the file says in a way that still works but should change (a deprecated
 *                    key), as {@code file:line:column: message}; every reader of policies shows them
 */
public record Policy(String source, List<Watch> watches, List<ChannelDeclaration> channels, List<AlertRule> alerts,
                     ProbabilityModels probability, List<PolicyProblem> warnings) {

    public Policy {
        watches = List.copyOf(watches);
        channels = List.copyOf(channels);
        alerts = List.copyOf(alerts);
        probability = probability == null ? ProbabilityModels.NONE : probability;
        warnings = warnings == null ? List.of() : List.copyOf(warnings);
    }

    /** A policy without warnings. */
    public Policy(String source, List<Watch> watches, List<ChannelDeclaration> channels, List<AlertRule> alerts,
                  ProbabilityModels probability) {
        this(source, watches, channels, alerts, probability, List.of());
    }

    /** A policy without probability models. */
    public Policy(String source, List<Watch> watches, List<ChannelDeclaration> channels, List<AlertRule> alerts) {
        this(source, watches, channels, alerts, ProbabilityModels.NONE);
    }

    /** A policy with spreads only, no alerting part. */
    public Policy(String source, List<Watch> watches) {
        this(source, watches, List.of(ChannelDeclaration.LOG), List.of());
    }
}
