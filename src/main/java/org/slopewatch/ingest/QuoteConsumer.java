package org.slopewatch.ingest;

import io.smallrye.reactive.messaging.annotations.Blocking;
import io.smallrye.reactive.messaging.kafka.api.OutgoingKafkaRecordMetadata;
import jakarta.enterprise.context.ApplicationScoped;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.concurrent.CompletionStage;
import org.apache.kafka.common.header.internals.RecordHeaders;
import org.eclipse.microprofile.reactive.messaging.Channel;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.eclipse.microprofile.reactive.messaging.Incoming;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.jboss.logging.Logger;
import org.slopewatch.ingest.kafka.PartitionOwnership;

/**
 * The messaging edge: one method takes each message of the {@code quotes} channel (one batch or,
 * from Kafka, a poll's worth) and hands it to the pipeline.
 *
 * <p>Failure strategy, chosen explicitly: a bad quote is not a failure. It was decoded into a
 * reject, which is journalled, counted and (from Kafka) copied to the dead-letter topic, and
 * the message is acknowledged. Only a failure to journal nacks the message; the Kafka channel is
 * configured with {@code failure-strategy=fail}, so consumption stops with the offset uncommitted
 * and nothing is lost: on restart the records are read again.
 *
 * <p>Records of partitions this instance no longer holds (a rebalance came between fetch and
 * processing) are left out: their new owner reads them again.
 */
@ApplicationScoped
public class QuoteConsumer {

    private static final Logger LOG = Logger.getLogger(QuoteConsumer.class);

    private final QuotePipeline pipeline;
    private final PartitionOwnership ownership;
    private final Emitter<String> deadLetters;

    QuoteConsumer(QuotePipeline pipeline, PartitionOwnership ownership, @Channel("quotes-dead-letter") Emitter<String> deadLetters) {
        this.pipeline = pipeline;
        this.ownership = ownership;
        this.deadLetters = deadLetters;
    }

    @Incoming("quotes")
    @Blocking(ordered = true)
    public CompletionStage<Void> consume(Message<List<QuoteBatch>> message) {
        List<QuoteBatch> batches = ownership.stillHeld(message);
        BatchOutcome outcome;
        try {
            outcome = pipeline.process(batches);
        } catch (RuntimeException e) {
            LOG.errorf("could not process %d quote batch(es): %s", message.getPayload().size(), e.getMessage());
            message.getMetadata(OutcomeReply.class).ifPresent(r -> r.outcome().completeExceptionally(e));
            return message.nack(e);
        }
        for (QuoteBatch batch : batches) {
            if (batch.origin().equals("kafka")) {
                batch.rejects().forEach(this::deadLetter);
            }
        }
        message.getMetadata(OutcomeReply.class).ifPresent(r -> r.outcome().complete(outcome));
        return message.ack();
    }

    private void deadLetter(Reject reject) {
        RecordHeaders headers = new RecordHeaders();
        headers.add("slopewatch-reason", reject.reason().code().getBytes(StandardCharsets.UTF_8));
        headers.add("slopewatch-detail", reject.detail().getBytes(StandardCharsets.UTF_8));
        deadLetters.send(Message.of(reject.raw() == null ? "" : reject.raw())
                .addMetadata(OutgoingKafkaRecordMetadata.<String>builder().withHeaders(headers).build()));
    }
}
