package org.slopewatch.monitor;

import org.slopewatch.spread.SpreadKey;

/** The average of one complete calendar quarter, reported when the quarter closes. */
public record QuarterSummary(SpreadKey spread, Quarter quarter, double averageBp, int observations) implements MonitorEvent {
}
