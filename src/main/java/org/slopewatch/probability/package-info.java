/**
 * Recession probability: the probit model P = Φ(α + β·s) on a term spread s in percentage
 * points, calendar-month averaging, recession calendars, and the maximum-likelihood fit with
 * model-based and Newey–West standard errors, and lead-time analysis of confirmations against
 * business-cycle peaks, with the one outcome per peak ({@link org.slopewatch.probability.PeakLead}:
 * ahead, late or missed, by its first confirmation, and against the peak's announcement when the
 * dates give it) that every report shows; and a live probability put in words ({@link org.slopewatch.probability.ProbabilityText}),
 * so that it is never shown without its spread, horizon, month and model.
 *
 * <p>Invariants: plain Java and Commons Math only (no container, no clock); spreads here are in
 * percentage points, not basis points; a live probability is given to
 * {@link org.slopewatch.curve.Resolution#PROBABILITY}, the resolution levels are compared at; a recession occupies the months after a peak through its
 * trough, inclusive. Failures of a fit are {@link org.slopewatch.probability.ProbitFitException}s
 * with a reason and a message a person can act on, never NaN coefficients.
 */
package org.slopewatch.probability;
