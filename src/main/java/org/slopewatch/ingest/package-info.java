/**
 * Ingest, the edges: decoding and validating quotes from HTTP bodies (JSON and CSV), the message
 * stream ({@code ingest.messaging}, {@code ingest.kafka}) and the demo feed ({@code ingest.demo}).
 *
 * <p>Invariants: bad input is rejected with its place and reason, never half-applied; what is
 * accepted the journal can keep as it was sent; values enter the engine in basis points on a
 * bond-equivalent basis. JSON and CSV bodies alike become a {@link org.slopewatch.pipeline.QuoteBatch}
 * whose rejects the pipeline journals and counts; a CSV file that cannot be read is refused whole,
 * at its {@code line:column}, and only {@link org.slopewatch.history.HistoryCsvReader} meets the CSV
 * parser's own exceptions.
 */
package org.slopewatch.ingest;
