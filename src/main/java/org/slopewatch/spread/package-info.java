/**
 * Spreads: definitions (two legs of one curve, or the near-term forward spread read off a
 * fitted curve) and their computation in basis points from a curve snapshot, taken to
 * {@link org.slopewatch.curve.Resolution#BASIS_POINTS} so that a spread of decimal quotes compares
 * with a threshold as its decimal value does.
 *
 * <p>A spread that cannot be computed on a date (a leg missing, a fit impossible) is NaN,
 * never a guess; the caller skips that date.
 */
package org.slopewatch.spread;
