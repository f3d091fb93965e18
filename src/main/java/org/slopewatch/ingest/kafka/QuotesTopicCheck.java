package org.slopewatch.ingest.kafka;

import io.quarkus.runtime.StartupEvent;
import io.smallrye.common.annotation.Identifier;
import jakarta.annotation.PreDestroy;
import jakarta.annotation.Priority;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.event.Observes;
import jakarta.interceptor.Interceptor;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.eclipse.microprofile.config.inject.ConfigProperty;
import org.jboss.logging.Logger;
import org.slopewatch.pipeline.IngestConfig;

/**
 * On Kafka, makes sure of the quotes topic before the consumer subscribes (the messaging connectors
 * start at {@code LIBRARY_BEFORE}; this runs just ahead of them), and warns when the consumer group
 * has more members than the topic has partitions: at start, counting this instance, and after each
 * assignment, when the group is settled. Neither check stops the daemon: a broker that cannot be
 * asked is logged and the consumer is left to wait for it as it always does.
 */
@ApplicationScoped
public class QuotesTopicCheck {

    static final String PARTITIONS = "slopewatch.kafka.quotes-partitions";
    /** The channel, whose name is also the connector's topic when none is set. */
    private static final String CHANNEL = "quotes";
    private static final Logger LOG = Logger.getLogger(QuotesTopicCheck.class);

    private final boolean onKafka;
    private final QuotesTopic topic;
    /** One thread for the check after an assignment, which must not hold up the consumer's poll. */
    private final ExecutorService afterAssignment = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "slopewatch-quotes-topic-check");
        t.setDaemon(true);
        return t;
    });

    QuotesTopicCheck(IngestConfig ingest, @Identifier("default-kafka-broker") Map<String, Object> kafka,
            @ConfigProperty(name = "mp.messaging.incoming.quotes.topic") Optional<String> topic,
            @ConfigProperty(name = "mp.messaging.incoming.quotes.group.id") Optional<String> group,
            @ConfigProperty(name = PARTITIONS, defaultValue = "12") int partitions,
            @ConfigProperty(name = "slopewatch.kafka.quotes-replication-factor") Optional<Short> replicationFactor) {
        if (partitions < 1) {
            throw new IllegalArgumentException(PARTITIONS + " must be at least 1, not " + partitions);
        }
        if (replicationFactor.isPresent() && replicationFactor.get() < 1) {
            throw new IllegalArgumentException("slopewatch.kafka.quotes-replication-factor must be at least 1, not " + replicationFactor.get());
        }
        this.onKafka = ingest.transport() == IngestConfig.Transport.KAFKA;
        this.topic = new QuotesTopic(kafka, new QuotesTopic.Settings(topic.orElse(CHANNEL), group.orElse(""), partitions, replicationFactor));
    }

    void onStart(@Observes @Priority(Interceptor.Priority.LIBRARY_BEFORE - 1) StartupEvent start) {
        if (onKafka) {
            atStart(topic);
        }
    }

    /** Creates the topic if it is missing and warns of a shortfall, counting the instance about to join. */
    static void atStart(QuotesTopic topic) {
        QuotesTopic.Settings s = topic.settings();
        try {
            if (topic.ensure()) {
                LOG.infof("quotes topic %s created with %d partition(s), replication factor %s", s.topic(), s.partitions(),
                        s.replicationFactor().map(String::valueOf).orElse("of the broker's default"));
            }
            topic.shortfall(1).ifPresent(f -> LOG.warn(f.message()));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } catch (Exception e) {
            LOG.warnf("could not make sure of quotes topic %s (the consumer waits for it): %s", s.topic(), e.toString());
        }
    }

    /** After an assignment: warns of a shortfall, on its own thread. */
    void assigned() {
        if (onKafka) {
            afterAssignment.execute(() -> afterAssignment(topic));
        }
    }

    static void afterAssignment(QuotesTopic topic) {
        try {
            topic.shortfall(0).ifPresent(f -> LOG.warn(f.message()));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } catch (Exception e) {
            LOG.debugf("could not compare quotes topic %s with its consumer group: %s", topic.settings().topic(), e.toString());
        }
    }

    @PreDestroy
    void stop() {
        afterAssignment.shutdownNow();
    }
}
