/**
 * The inversion monitor: one state machine per spread (NORMAL, INVERTED, CONFIRMED,
 * RESTEEPENING), the four persistence tests, spells, transitions with their evidence, and
 * revisions of past values.
 *
 * <p>Invariants: time comes in with the observations (market dates), never from a clock; a
 * monitor sees strictly increasing dates, and replacements and revisions go through
 * {@link org.slopewatch.monitor.SpreadTrack}, which reports any changed outcome as a
 * {@link org.slopewatch.monitor.Revision}; values, thresholds and averages are compared in whole
 * steps of {@link org.slopewatch.curve.Resolution#BASIS_POINTS}, sums kept exact in them. A track may
 * hold only a window of its history over a base state, with the transitions and spells after the
 * base; what it let go of it reads back through
 * {@link org.slopewatch.monitor.EarlierObservations}, and it writes itself as bytes for checkpoints
 * ({@code TrackCodec}). Plain Java only.
 */
package org.slopewatch.monitor;
