package org.slopewatch.pipeline;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.util.List;

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

    enum Transport { EMBEDDED, KAFKA }
}
