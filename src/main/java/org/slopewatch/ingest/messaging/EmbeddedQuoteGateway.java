package org.slopewatch.ingest.messaging;

import io.smallrye.reactive.messaging.memory.InMemoryConnector;
import io.smallrye.reactive.messaging.memory.InMemorySource;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionStage;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.eclipse.microprofile.reactive.messaging.Metadata;
import org.slopewatch.ingest.QuoteGateway;
import org.slopewatch.pipeline.BatchOutcome;
import org.slopewatch.pipeline.QuoteBatch;

/**
 * The embedded default: batches go onto the in-process {@code quotes} channel and the caller
 * gets the processing outcome back.
 */
final class EmbeddedQuoteGateway implements QuoteGateway {

    // the source sends a Message as it is, metadata included
    private final InMemorySource<Object> quotes;

    EmbeddedQuoteGateway(InMemoryConnector connector) {
        this.quotes = connector.source("quotes");
    }

    @Override
    public CompletionStage<Submitted> submit(QuoteBatch batch) {
        CompletableFuture<BatchOutcome> outcome = new CompletableFuture<>();
        Message<List<QuoteBatch>> message = Message.of(List.of(batch), Metadata.of(new OutcomeReply(outcome)));
        // a reactive stream takes one item at a time: concurrent requests are serialised here
        synchronized (this) {
            quotes.send(message.withNack(e -> {
                outcome.completeExceptionally(e);
                return CompletableFuture.completedFuture(null);
            }));
        }
        return outcome.thenApply(o -> new Submitted(true, o));
    }
}
