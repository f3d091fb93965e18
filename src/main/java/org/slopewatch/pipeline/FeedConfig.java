package org.slopewatch.pipeline;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;

/** When a curve's feed counts as stale. */
@ConfigMapping(prefix = "slopewatch.feeds")
public interface FeedConfig {

    /** Business hours (Monday to Friday) without an accepted quote after which a curve's feed is stale. */
    @WithDefault("4")
    double staleAfterBusinessHours();
}
