/**
 * Policy: the rule files a desk signs off (which spreads to watch, what confirms an inversion,
 * later who hears about it), their parsing and validation.
 *
 * <p>Invariants: every problem in a file is reported with {@code file:line:column}; a policy
 * object exists only when its file had no problem. Plain Java and a YAML reader only.
 */
package org.slopewatch.rules;
