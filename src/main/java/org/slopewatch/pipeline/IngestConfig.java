package org.slopewatch.pipeline;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.util.List;
import java.util.Optional;

/** How quotes come in and what they must satisfy. */
@ConfigMapping(prefix = "slopewatch.ingest")
public interface IngestConfig {

    /** The curves the desk watches; quotes for others are rejected. */
    List<String> curves();

    /** The policy file naming the spreads and persistence tests. */
    String policy();

    /** A market date more than this many days ahead is rejected. */
    @WithDefault("3")
    int maxDaysAhead();

    /** Plausible yields in percent; outside is a unit mistake. */
    @WithDefault("-5")
    double minYieldPercent();

    @WithDefault("30")
    double maxYieldPercent();

    /** {@code embedded} (in-process channel) or {@code kafka} (HTTP and demo publish to the topic). */
    @WithDefault("embedded")
    Transport transport();

    /** The most quote messages one HTTP request may carry; more is answered 413 (the body size itself is quarkus.http.limits.max-body-size). */
    @WithDefault("20000")
    int maxBatch();

    /**
     * The most message ids kept in memory for de-duplication, the most recently used; an id older
     * than those is looked up in the journal, so de-duplication stays exact while memory stays bounded.
     */
    @WithDefault(QuotePipeline.Memory.DEFAULT_SEEN_IDS)
    int seenIdsCache();

    /**
     * Calendar days of each curve's snapshots and each spread's values held in memory for revisions;
     * a revision dated before them is re-run from the journal. Bounds memory whatever the history's length.
     */
    @WithDefault(QuotePipeline.Memory.DEFAULT_DAYS)
    int memoryDays();

    /**
     * How often the state of the curves that changed is checkpointed in the journal (also at shutdown),
     * so that a start replays only the quotes after it; 0 writes none.
     */
    @WithDefault("5m")
    java.time.Duration checkpointEvery();

    /**
     * With several instances on Kafka: how often the curves other instances own are brought up to date
     * from the journal, so that every instance answers reads of every curve; 0 turns it off.
     */
    @WithDefault("5s")
    java.time.Duration followEvery();

    /**
     * The series map of SDMX-CSV bodies ({@code KEY,CURVE,TENOR} lines); without it an SDMX-CSV body is refused.
     * Read once at start-up: a map that cannot be read stops it.
     */
    Optional<String> seriesMap();

    enum Transport { EMBEDDED, KAFKA }
}
