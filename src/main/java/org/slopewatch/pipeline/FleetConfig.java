package org.slopewatch.pipeline;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.Duration;
import java.util.Optional;

/** Several instances on one journal: what this one is called, how often it looks at the others, and when one counts as gone. */
@ConfigMapping(prefix = "slopewatch.fleet")
public interface FleetConfig {

    /** This instance's name in the journal; unset, the host name and the process id ({@link InstanceId}). */
    Optional<String> instanceId();

    /** How often the journal is asked for reloads accepted elsewhere, and this instance's heartbeat written; 0 turns both off. */
    @WithDefault("5s")
    Duration checkEvery();

    /** An instance whose heartbeat is older than this is gone: the wellness check leaves it out. Longer than {@link #checkEvery()}. */
    @WithDefault("30s")
    Duration liveWithin();
}
