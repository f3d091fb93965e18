package org.slopewatch.ingest;

import io.smallrye.reactive.messaging.memory.InMemoryConnector;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import org.eclipse.microprofile.reactive.messaging.Channel;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.eclipse.microprofile.reactive.messaging.spi.Connector;
import org.slopewatch.ingest.kafka.KafkaQuoteGateway;

/** Chooses how HTTP and the demo feed reach the {@code quotes} channel, by {@code slopewatch.ingest.transport}. */
@ApplicationScoped
public class GatewayBeans {

    @Produces
    @Singleton
    QuoteGateway quoteGateway(IngestConfig config, @Connector("smallrye-in-memory") InMemoryConnector memory,
                              @Channel("quotes-publish") Emitter<String> topic) {
        return config.transport() == IngestConfig.Transport.KAFKA ? new KafkaQuoteGateway(topic) : new EmbeddedQuoteGateway(memory);
    }
}
