/**
 * Pulled sources: publications the daemon fetches itself on the Quarkus scheduler
 * ({@link org.slopewatch.ingest.pull.SourceSchedule}, {@code slopewatch.sources.<name>.*}), one
 * conditional GET at a time ({@link org.slopewatch.ingest.pull.HttpFetcher}), read as any history
 * file by the CSV decoder and handed to the pipeline by {@link org.slopewatch.ingest.pull.SourcePuller}.
 *
 * <p>Invariants: a body is read whole, within its time-out and size limit, or not at all; only dates
 * the curve book does not hold, or holds with other yields, are forwarded, oldest first; every
 * attempt is journalled ({@code journal.SourceFetches}) and retried only on the delivery's one
 * {@code RetryPolicy}; no message or journal row carries the URL.
 */
package org.slopewatch.ingest.pull;
