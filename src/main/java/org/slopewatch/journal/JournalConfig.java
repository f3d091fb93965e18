package org.slopewatch.journal;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.Duration;
import java.util.Optional;

/** Where the journal lives: an H2 file by default, PostgreSQL for shared deployments. */
@ConfigMapping(prefix = "slopewatch.journal")
public interface JournalConfig {

    /** JDBC URL: {@code jdbc:h2:file:…} (embedded) or {@code jdbc:postgresql://…} (shared). */
    String url();

    Optional<String> username();

    Optional<String> password();

    @WithDefault("8")
    int maxConnections();

    /**
     * How long start-up waits for an unreachable journal before it gives up: the database may start
     * after the daemon, or be restarting, and a supervisor that restarts a failed daemon gives up
     * after a few quick failures.
     */
    @WithDefault("2m")
    Duration startWait();
}
