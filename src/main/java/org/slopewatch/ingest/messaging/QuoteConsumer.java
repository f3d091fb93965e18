package org.slopewatch.ingest.messaging;

import io.smallrye.reactive.messaging.annotations.Blocking;
import io.smallrye.reactive.messaging.kafka.api.IncomingKafkaRecordBatchMetadata;
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
import org.eclipse.microprofile.reactive.messaging.OnOverflow;
import org.jboss.logging.Logger;
import org.slopewatch.ingest.kafka.PartitionOwnership;
import org.slopewatch.ingest.kafka.TakeoverQueue;
import org.slopewatch.journal.JournalException;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.pipeline.BatchOutcome;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.pipeline.Reject;

/**
 * The messaging edge: one method takes each message of the {@code quotes} channel (one batch or,
 * from Kafka, a poll's worth) and hands it to the pipeline.
 *
 * <p>Failure strategy, chosen explicitly: a bad quote is not a failure. It was decoded into a
 * reject, which is journalled, counted and (from Kafka) copied to the dead-letter topic, and
 * the message is acknowledged. A journal that cannot be reached (the database down or
 * restarting) holds a Kafka message here, unacknowledged, retried with a growing pause (0.5 s
 * to 10 s) until the journal answers; readiness is down meanwhile ({@code JournalHealthCheck}).
 * Any other failure to journal nacks the message; the Kafka channel is configured with
 * {@code failure-strategy=fail}, so consumption stops with the offset uncommitted and nothing is
 * lost: on restart the records are read again. From HTTP (embedded) the caller gets the error
 * and sends again.
 *
 * <p>Records of partitions this instance no longer holds (a rebalance came between fetch and
 * processing) are left out: their new owner reads them again. Records of partitions just assigned
 * wait until their curves are rebuilt from the journal ({@code TakeoverQueue}).
 */
@ApplicationScoped
public class QuoteConsumer {

    private static final Logger LOG = Logger.getLogger(QuoteConsumer.class);

    private static final long FIRST_PAUSE_MS = 500;
    private static final long MAX_PAUSE_MS = 10_000;

    private final QuotePipeline pipeline;
    private final PartitionOwnership ownership;
    private final TakeoverQueue takeovers;
    private final JournalReader journal;
    private final Emitter<String> deadLetters;

    QuoteConsumer(QuotePipeline pipeline, PartitionOwnership ownership, TakeoverQueue takeovers, JournalReader journal,
                  @Channel("quotes-dead-letter") @OnOverflow(value = OnOverflow.Strategy.BUFFER, bufferSize = 10_000)
                  Emitter<String> deadLetters) {
        this.pipeline = pipeline;
        this.ownership = ownership;
        this.takeovers = takeovers;
        this.journal = journal;
        this.deadLetters = deadLetters;
    }

    @Incoming("quotes")
    @Blocking(ordered = true)
    public CompletionStage<Void> consume(Message<List<QuoteBatch>> message) {
        List<QuoteBatch> batches;
        BatchOutcome outcome;
        for (long pause = FIRST_PAUSE_MS; ; pause = Math.min(pause * 2, MAX_PAUSE_MS)) {
            // records of partitions just assigned wait until their curves are rebuilt from the journal
            takeovers.awaitRebuilt();
            batches = ownership.stillHeld(message); // again on each try: a rebalance may have come meanwhile
            try {
                outcome = pipeline.process(batches);
                break;
            } catch (RuntimeException e) {
                if (!waitedForJournal(message, e, pause)) {
                    LOG.errorf("could not process %d quote batch(es): %s", message.getPayload().size(), e.getMessage());
                    message.getMetadata(OutcomeReply.class).ifPresent(r -> r.outcome().completeExceptionally(e));
                    return message.nack(e);
                }
            }
        }
        for (QuoteBatch batch : batches) {
            if (batch.origin().equals("kafka")) {
                batch.rejects().forEach(this::deadLetter);
            }
        }
        BatchOutcome done = outcome;
        message.getMetadata(OutcomeReply.class).ifPresent(r -> r.outcome().complete(done));
        return message.ack();
    }

    /**
     * Whether the failure is one to wait out, having waited: a Kafka message that failed on a
     * connection to the journal, or while the journal does not answer. False for anything else,
     * and when interrupted (shutting down).
     */
    private boolean waitedForJournal(Message<?> message, RuntimeException failure, long pauseMs) {
        if (message.getMetadata(IncomingKafkaRecordBatchMetadata.class).isEmpty()
                || !JournalException.isConnectionFailure(failure) && journal.reachable()) {
            return false;
        }
        LOG.warnf("journal unreachable (%s): the quotes wait on Kafka, unacknowledged; trying again in %d ms", failure.getMessage(),
                pauseMs);
        try {
            Thread.sleep(pauseMs);
            return true;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return false;
        }
    }

    private void deadLetter(Reject reject) {
        RecordHeaders headers = new RecordHeaders();
        headers.add("slopewatch-reason", reject.reason().code().getBytes(StandardCharsets.UTF_8));
        headers.add("slopewatch-detail", reject.detail().getBytes(StandardCharsets.UTF_8));
        try {
            deadLetters.send(Message.of(reject.raw() == null ? "" : reject.raw())
                    .addMetadata(OutgoingKafkaRecordMetadata.<String>builder().withHeaders(headers).build()));
        } catch (RuntimeException e) {
            // the copy is a convenience: the reject is journalled and counted already, and failing the
            // batch here would stop the consumer over a dead-letter producer that is not ready yet
            LOG.warnf("reject (%s) not copied to the dead-letter topic: %s", reject.reason().code(), e.getMessage());
        }
    }
}
