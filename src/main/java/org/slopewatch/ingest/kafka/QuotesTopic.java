package org.slopewatch.ingest.kafka;

import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.NewTopic;
import org.apache.kafka.common.errors.GroupIdNotFoundException;
import org.apache.kafka.common.errors.TopicExistsException;

/**
 * The quotes topic as the daemon finds it on the broker, through Kafka's admin client: created
 * with its partitions when it is missing, and its partition count compared with the members of the
 * consumer group. A broker left at its defaults would otherwise create the topic on first use with
 * one partition ({@code num.partitions=1}), and every instance but one would idle.
 *
 * <p>An existing topic is never altered: adding partitions moves curves to other partitions (the
 * key's hash modulo the count), which an operator should choose, not a starting daemon.
 */
public final class QuotesTopic {

    /**
     * What the topic should be; an empty replication factor takes the broker's
     * {@code default.replication.factor}, an empty group means none was named.
     */
    public record Settings(String topic, String group, int partitions, Optional<Short> replicationFactor) {
    }

    /** How long one admin request may take before the daemon carries on without its answer. */
    static final Duration PATIENCE = Duration.ofSeconds(15);

    private final Map<String, Object> adminConfig;
    private final Settings settings;

    public QuotesTopic(Map<String, Object> adminConfig, Settings settings) {
        this.adminConfig = Map.copyOf(adminConfig);
        this.settings = settings;
    }

    public Settings settings() {
        return settings;
    }

    /** Creates the topic unless it exists; true when this call created it. */
    public boolean ensure() throws InterruptedException, ExecutionException, TimeoutException {
        try (Admin admin = Admin.create(adminConfig)) {
            NewTopic topic = new NewTopic(settings.topic(), Optional.of(settings.partitions()), settings.replicationFactor());
            admin.createTopics(List.of(topic)).all().get(PATIENCE.toMillis(), TimeUnit.MILLISECONDS);
            return true;
        } catch (ExecutionException e) {
            if (e.getCause() instanceof TopicExistsException) {
                return false;
            }
            throw e;
        }
    }

    /**
     * The shortfall, if the topic has fewer partitions than the group has members plus {@code joining}
     * (an instance about to join, which the broker does not list yet).
     */
    public Optional<PartitionShortfall> shortfall(int joining) throws InterruptedException, ExecutionException, TimeoutException {
        if (settings.group().isEmpty()) {
            return Optional.empty(); // no group named: the connector makes one up per instance, so there is no fleet
        }
        try (Admin admin = Admin.create(adminConfig)) {
            int partitions = admin.describeTopics(List.of(settings.topic())).allTopicNames()
                    .get(PATIENCE.toMillis(), TimeUnit.MILLISECONDS).get(settings.topic()).partitions().size();
            int members;
            try {
                members = admin.describeConsumerGroups(List.of(settings.group())).all()
                        .get(PATIENCE.toMillis(), TimeUnit.MILLISECONDS).get(settings.group()).members().size();
            } catch (ExecutionException e) {
                if (!(e.getCause() instanceof GroupIdNotFoundException)) {
                    throw e;
                }
                members = 0; // no instance has joined yet
            }
            return PartitionShortfall.of(settings.topic(), partitions, settings.group(), members + joining);
        }
    }
}
