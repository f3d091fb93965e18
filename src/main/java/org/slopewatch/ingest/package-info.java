/**
 * Ingest: decoding and validating quotes from files, HTTP, the message stream and the demo feed.
 *
 * <p>Invariants: bad input is rejected with its place and reason, never half-applied; values
 * enter the engine in basis points on a bond-equivalent basis.
 */
package org.slopewatch.ingest;
