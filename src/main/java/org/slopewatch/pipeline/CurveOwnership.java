package org.slopewatch.pipeline;

/**
 * Which watched curves this instance answers for when the clock, not a quote, decides something:
 * stale feeds and repeated notices. One instance answers for every curve; instances sharing a
 * Kafka consumer group each answer for the curves whose partitions they hold, so that a curve's
 * clock-driven notices come from exactly one of them.
 */
@FunctionalInterface
public interface CurveOwnership {

    /** A single instance: every curve is its own. */
    CurveOwnership ALL = curve -> true;

    boolean owns(String curve);
}
