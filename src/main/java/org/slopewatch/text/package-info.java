/**
 * Text that came from outside, as the rest of the daemon may repeat or keep it: one rule for
 * which characters are refused or escaped ({@link org.slopewatch.text.ControlCharacters}), one
 * way to quote input in a message or a log line ({@link org.slopewatch.text.Excerpt}) and one
 * check of a text field that the journal keeps ({@link org.slopewatch.text.FieldText}).
 *
 * <p>Invariants: a quoted excerpt is at most a few hundred characters whatever the input, and
 * holds no character that starts a new line; plain Java, usable from the engine packages.
 */
package org.slopewatch.text;
