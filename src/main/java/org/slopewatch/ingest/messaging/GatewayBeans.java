package org.slopewatch.ingest.messaging;

import io.smallrye.reactive.messaging.memory.InMemoryConnector;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import org.eclipse.microprofile.reactive.messaging.Channel;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.eclipse.microprofile.reactive.messaging.spi.Connector;
import org.slopewatch.ingest.QuoteGateway;
import org.slopewatch.ingest.kafka.KafkaQuoteGateway;
import org.slopewatch.ingest.kafka.PartitionOwnership;
import org.slopewatch.pipeline.CurveOwnership;
import org.slopewatch.pipeline.IngestConfig;

/**
 * Chooses, by {@code slopewatch.ingest.transport}, how HTTP and the demo feed reach the {@code quotes} channel and which
 * curves this instance answers for.
 */
@ApplicationScoped
public class GatewayBeans {

    @Produces
    @Singleton
    QuoteGateway quoteGateway(IngestConfig config, @Connector("smallrye-in-memory") InMemoryConnector memory,
                              @Channel("quotes-publish") Emitter<String> topic) {
        return config.transport() == IngestConfig.Transport.KAFKA ? new KafkaQuoteGateway(topic) : new EmbeddedQuoteGateway(memory);
    }

    /** On Kafka the curves whose partitions this instance holds; embedded, every curve. */
    @Produces
    @Singleton
    CurveOwnership curveOwnership(IngestConfig config, PartitionOwnership partitions) {
        return config.transport() == IngestConfig.Transport.KAFKA ? partitions::ownsCurve : CurveOwnership.ALL;
    }
}
