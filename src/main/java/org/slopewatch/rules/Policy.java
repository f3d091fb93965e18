package org.slopewatch.rules;

import java.util.List;
import org.slopewatch.monitor.Watch;

/**
 * A desk's signed-off policy: the spreads it watches and how an inversion is confirmed.
 *
 * @param source where it was read from, for messages
 */
public record Policy(String source, List<Watch> watches) {

    public Policy {
        watches = List.copyOf(watches);
    }
}
