package org.slopewatch.ingest.kafka;

import java.util.Optional;

/**
 * Whether the quotes topic has too few partitions for the instances reading it. Kafka gives each
 * partition of a topic to at most one member of a consumer group, so members beyond the partition
 * count receive nothing and idle: a fleet larger than the topic's partitions is partly spare.
 */
public record PartitionShortfall(String topic, int partitions, String group, int members) {

    /** The shortfall, when the group has more members than the topic has partitions. */
    public static Optional<PartitionShortfall> of(String topic, int partitions, String group, int members) {
        return members > partitions ? Optional.of(new PartitionShortfall(topic, partitions, group, members)) : Optional.empty();
    }

    /** The log line: both numbers and what to do about them. */
    public String message() {
        return "quotes topic " + topic + " has " + partitions + " partition(s) but consumer group " + group + " has " + members
                + " member(s): " + (members - partitions) + " instance(s) get no partition and process no quotes;"
                + " add partitions to the topic (which moves curves between partitions, see deploy/README.md) or run fewer instances";
    }
}
