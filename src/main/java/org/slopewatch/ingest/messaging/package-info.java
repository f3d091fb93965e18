/**
 * The {@code quotes} channel: the consumer that hands each message to the pipeline
 * ({@link org.slopewatch.ingest.messaging.QuoteConsumer}) and the choice, by
 * {@code slopewatch.ingest.transport}, of how HTTP and the demo feed reach it (in process, or
 * through the Kafka topic).
 */
package org.slopewatch.ingest.messaging;
