package org.slopewatch.journal;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
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
}
