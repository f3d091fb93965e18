package org.slopewatch.ingest;

import java.util.concurrent.CompletionStage;
import org.slopewatch.pipeline.BatchOutcome;
import org.slopewatch.pipeline.QuoteBatch;

/** Where HTTP and the demo feed hand their decoded quotes: the {@code quotes} channel, directly or through the topic. */
public interface QuoteGateway {

    /**
     * Submits one batch.
     *
     * @return what processing did with it (embedded), or the counts queued on the topic (Kafka),
     *         in which case {@link Submitted#processed()} is false
     */
    CompletionStage<Submitted> submit(QuoteBatch batch);

    /** The answer to a submission. */
    record Submitted(boolean processed, BatchOutcome outcome) {
    }
}
