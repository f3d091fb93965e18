/**
 * Recession probability and evidence: the probit model, its fitting, and lead-time analysis of
 * confirmations against business-cycle dates.
 *
 * <p>Invariants: spreads enter in percentage points for the probit (the literature's unit);
 * months are calendar months. Plain Java and Commons Math only.
 */
package org.slopewatch.probability;
