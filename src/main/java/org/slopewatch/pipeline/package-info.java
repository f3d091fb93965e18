/**
 * The step at the centre of the daemon: {@link org.slopewatch.pipeline.QuotePipeline} takes a
 * {@link org.slopewatch.pipeline.QuoteBatch} from any edge, moves the monitors, asks the alerting
 * side for the notices the step calls for, and journals all of it in one transaction. Around it:
 * the batch, reject and outcome types every edge speaks, the listeners (metrics), the policy's
 * hot reload ({@link org.slopewatch.pipeline.PolicyReloader}) and its reach across instances on one
 * journal ({@link org.slopewatch.pipeline.PolicyFleet}: an accepted reload is journalled and every
 * other instance takes it from its own file, never content its file does not give), the clock-driven tick
 * ({@link org.slopewatch.pipeline.AlertTicker}) with feed freshness, how each pulled source is doing
 * ({@link org.slopewatch.pipeline.PulledSources}), the as-of rebuild of past
 * states, the bulk load of history through the same step ({@link org.slopewatch.pipeline.HistoryBackfill}),
 * and the beans that build the pipeline from configuration.
 *
 * <p>Invariants: one step at a time, under the pipeline's lock; memory never runs ahead of the
 * journal (a failed step rebuilds from it); de-duplication is exact while memory stays bounded
 * ({@link org.slopewatch.pipeline.SeenIds}: recent ids in memory, the journal for the rest); the same messages give the same states and notices
 * however they were batched or whichever edge brought them.
 *
 * <p>Depends on the engine, the journal and alerting; the edges ({@code ingest}), operations and
 * the API depend on it, never the other way round.
 */
package org.slopewatch.pipeline;
