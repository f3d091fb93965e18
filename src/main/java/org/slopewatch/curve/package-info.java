/**
 * Curves: tenors, yield units, curve snapshots per curve and market date, bill conversions,
 * interpolation and the Nelson–Siegel–Svensson fit; and {@link org.slopewatch.curve.Resolution},
 * the one rule of the resolution values are compared with thresholds and written out at.
 *
 * <p>Invariants: every yield inside the engine is in basis points on a bond-equivalent basis, taken
 * to {@link org.slopewatch.curve.Resolution#BASIS_POINTS} in its snapshot; values are checked
 * against {@link org.slopewatch.curve.YieldBounds} on the way in, never rescaled by guesswork.
 * Plain Java and Commons Math only.
 */
package org.slopewatch.curve;
