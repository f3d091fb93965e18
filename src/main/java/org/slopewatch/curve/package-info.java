/**
 * Curves: tenors, yield units, curve snapshots per curve and market date, bill conversions,
 * interpolation and the Nelson–Siegel–Svensson fit. The rules every reader of quotes shares live
 * here: the basis a quote declares and its conversion ({@link org.slopewatch.curve.YieldBasis}),
 * the weekly bills read as month points in history files ({@link org.slopewatch.curve.TenorAliases}),
 * and {@link org.slopewatch.curve.Resolution}, the one rule of the resolution values are compared
 * with thresholds and written out at.
 *
 * <p>Invariants: every yield inside the engine is in basis points on a bond-equivalent basis, taken
 * to {@link org.slopewatch.curve.Resolution#BASIS_POINTS} in its snapshot; values are checked
 * against {@link org.slopewatch.curve.YieldBounds} on the way in, never rescaled by guesswork. A
 * fit is a function of its snapshot alone (no warm start from another date); what it keeps between
 * snapshots ({@code DecayGrids}, the decay grid per set of maturities, with the plan of its
 * exponentials, {@code Exponentials}) is immutable and a function of the maturities alone. Plain Java and Commons Math only.
 */
package org.slopewatch.curve;
