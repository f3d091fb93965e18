package org.slopewatch.monitor;

import java.util.Set;
import org.slopewatch.spread.SpreadDefinition;

/**
 * One spread the desk watches, with its monitoring rules, on the named curves (all curves when
 * {@code curves} is empty).
 */
public record Watch(SpreadDefinition spread, MonitorDefinition rules, Set<String> curves) {

    public Watch {
        curves = Set.copyOf(curves);
    }

    public boolean appliesTo(String curve) {
        return curves.isEmpty() || curves.contains(curve);
    }
}
