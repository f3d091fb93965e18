/**
 * Curves: tenors, yield units, curve snapshots per curve and market date, bill conversions,
 * interpolation and the Nelson–Siegel–Svensson fit.
 *
 * <p>Invariants: every yield inside the engine is in basis points on a bond-equivalent basis;
 * values are checked against {@link org.slopewatch.curve.YieldBounds} on the way in, never
 * rescaled by guesswork. Plain Java and Commons Math only.
 */
package org.slopewatch.curve;
