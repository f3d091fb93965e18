/**
 * Ingest: decoding and validating quotes from files, HTTP, the message stream and the demo feed.
 *
 * <p>Invariants: bad input is rejected with its place and reason, never half-applied; what is
 * accepted the journal can keep as it was sent; values enter the engine in basis points on a
 * bond-equivalent basis.
 */
package org.slopewatch.ingest;
