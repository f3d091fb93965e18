/**
 * Policy: the rule files a desk signs off (which spreads to watch, what confirms an inversion,
 * which recession-probability models it accepts, who hears about it), their parsing and
 * validation.
 *
 * <p>Invariants: every problem in a file is reported with {@code file:line:column}; a policy
 * object exists only when its file had no problem; every probability model names a watched
 * spread and its source, and every {@code probability-above} rule covers only spreads with a
 * model and reads the last complete calendar month (the models are fitted on whole months) unless it
 * asks for the month so far ({@link org.slopewatch.rules.ProbabilityMonth}); any text, however hostile, is answered with a policy or such problems, never another
 * exception, and nothing in it is evaluated; the answer stays small whatever the text (limits on
 * length, nesting and expansion through aliases, quoted values as excerpts, at most a hundred
 * problems listed); a persistence test is read by {@link org.slopewatch.rules.PersistenceForms}
 * whichever way it is written, in a policy or on replay's command line, so it means the same and is
 * refused in the same words. Policy keys renamed in the present vocabulary are still read under
 * their old names for one release, with a warning ({@code DeprecatedNames}); warnings never stop a
 * policy. Notices speak of a spread's figures through {@code SpreadText}, so that every text gives
 * the same numbers. Plain Java and a YAML reader only.
 */
package org.slopewatch.rules;
