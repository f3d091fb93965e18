package org.slopewatch.rules;

import java.time.Duration;
import java.util.List;
import java.util.Set;

/**
 * One alert rule of the policy.
 *
 * @param spreads        spread names it applies to (empty: every watched spread)
 * @param channels       channel names the alert goes to
 * @param standingEvery  how often a standing notice follows the opening one while it stays true
 *                       ({@link Duration#ZERO}: never)
 * @param closingNotice  whether to send a closing notice when it stops being true
 * @param message        template; {@code {curve}}, {@code {spread}}, {@code {state}}, {@code {value}},
 *                       {@code {reason}}, {@code {days}}, {@code {date}} are filled in
 */
public record AlertRule(String name, AlertTrigger when, Set<String> spreads, Severity severity, List<String> channels,
                        Duration standingEvery, boolean closingNotice, String message) {

    public AlertRule {
        spreads = Set.copyOf(spreads);
        channels = List.copyOf(channels);
    }
}
