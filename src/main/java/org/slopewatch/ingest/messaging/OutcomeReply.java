package org.slopewatch.ingest.messaging;

import java.util.concurrent.CompletableFuture;
import org.slopewatch.pipeline.BatchOutcome;

/**
 * Message metadata by which a sender in the same process (the HTTP endpoint on the embedded
 * channel) learns what processing did with its batch.
 */
public record OutcomeReply(CompletableFuture<BatchOutcome> outcome) {
}
