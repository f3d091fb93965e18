package org.slopewatch.monitor;

/** What a monitor reports as it consumes observations. */
public sealed interface MonitorEvent permits Transition, QuarterSummary, Spell, Revision, SpellRestatement {
}
