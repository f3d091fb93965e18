/**
 * Ingest: decoding and validating quotes from files, HTTP, the message stream and the demo feed.
 *
 * <p>Invariants: bad input is rejected with its place and reason, never half-applied; what is
 * accepted the journal can keep as it was sent; values enter the engine in basis points on a
 * bond-equivalent basis. JSON and CSV bodies alike become a {@link org.slopewatch.ingest.QuoteBatch}
 * whose rejects the pipeline journals and counts; a CSV file that cannot be read is refused whole,
 * at its {@code line:column}, and only {@link org.slopewatch.ingest.HistoryCsvReader} meets the CSV
 * parser's own exceptions.
 */
package org.slopewatch.ingest;
