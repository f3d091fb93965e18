package org.slopewatch.ingest.pull;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import io.smallrye.config.WithParentName;
import java.time.Duration;
import java.util.Map;
import java.util.Optional;

/**
 * The pulled sources, by name: {@code slopewatch.sources.<name>.url} and how often to fetch it. The
 * layout of what it serves is recognised from its header, as for every history file.
 */
@ConfigMapping(prefix = "slopewatch.sources")
public interface SourcesConfig {

    @WithParentName
    Map<String, Source> sources();

    /** One source. */
    interface Source {

        /** Where the publication is fetched: an {@code http} or {@code https} URL. May carry a token, so it is never logged. */
        String url();

        /** The curve of a one-curve layout (Treasury, H.15, slopewatch's wide CSV); long files and SDMX-CSV name their own. */
        Optional<String> curve();

        /** How often to fetch. */
        @WithDefault("1h")
        Duration every();

        /** A series map file for an SDMX-CSV publication; without it SDMX-CSV is refused. */
        Optional<String> seriesMap();

        /** The yield unit of the publication ({@code percent}, {@code bp}, {@code decimal}). */
        @WithDefault("percent")
        String unit();

        /** The time-out for connecting and for the whole answer. */
        @WithDefault("30s")
        Duration timeout();

        /** The largest body read; a longer one is refused whole. */
        @WithDefault("16777216")
        long maxBytes();
    }
}
