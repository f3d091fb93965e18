package org.slopewatch.ingest.kafka;

import io.smallrye.reactive.messaging.kafka.api.OutgoingKafkaRecordMetadata;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionStage;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.slopewatch.ingest.QuoteGateway;
import org.slopewatch.pipeline.BatchOutcome;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;

/**
 * With Kafka, HTTP and the demo feed publish accepted messages to the quotes topic keyed by
 * curve, so that every quote reaches the instance that owns its curve's partition. The answer
 * counts what was queued; processing happens when the consumer reads it back.
 */
public final class KafkaQuoteGateway implements QuoteGateway {

    private final Emitter<String> topic;

    public KafkaQuoteGateway(Emitter<String> topic) {
        this.topic = topic;
    }

    @Override
    public CompletionStage<Submitted> submit(QuoteBatch batch) {
        List<CompletableFuture<Void>> sent = new ArrayList<>();
        for (QuoteMessage m : batch.messages()) {
            CompletableFuture<Void> done = new CompletableFuture<>();
            topic.send(Message.of(QuoteJson.encode(m))
                    .addMetadata(OutgoingKafkaRecordMetadata.<String>builder().withKey(m.curve()).build())
                    .withAck(() -> {
                        done.complete(null);
                        return CompletableFuture.completedFuture(null);
                    })
                    .withNack(e -> {
                        done.completeExceptionally(e);
                        return CompletableFuture.completedFuture(null);
                    }));
            sent.add(done);
        }
        return CompletableFuture.allOf(sent.toArray(new CompletableFuture[0]))
                .thenApply(v -> new Submitted(false, new BatchOutcome(batch.messages().size(), 0, batch.rejects().size(), 0,
                        batch.rejects())));
    }
}
