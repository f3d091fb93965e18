package org.slopewatch.rules;

import java.util.List;
import org.slopewatch.monitor.Watch;

/**
 * A desk's signed-off policy: the spreads it watches, how an inversion is confirmed, and who
 * hears about it (channels and alert rules).
 *
 * @param source where it was read from, for messages
 */
public record Policy(String source, List<Watch> watches, List<ChannelDeclaration> channels, List<AlertRule> alerts) {

    public Policy {
        watches = List.copyOf(watches);
        channels = List.copyOf(channels);
        alerts = List.copyOf(alerts);
    }

    /** A policy with spreads only, no alerting part. */
    public Policy(String source, List<Watch> watches) {
        this(source, watches, List.of(ChannelDeclaration.LOG), List.of());
    }
}
