package org.slopewatch.security;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.util.List;
import java.util.Optional;

/** Access to the API: see {@link AccessRule} for which request needs which role. */
@ConfigMapping(prefix = "slopewatch.security")
public interface SecurityConfig {

    /** Off only on a closed network: then every request is let through. */
    @WithDefault("true")
    boolean enabled();

    /** Tokens with the read role: plain (at least 16 characters) or {@code sha256:<hex>}; keep them in the environment. */
    Optional<List<String>> readTokens();

    /** Tokens with the write role (they may read too). */
    Optional<List<String>> writeTokens();

    /** Reads of the API ({@code /api/...}, {@code /q/openapi}, paths in normal form) without a token, for a trusted network. */
    @WithDefault("false")
    boolean openReads();

    /** {@code /q/metrics}, spelled exactly so, without a token (Prometheus can also send one). */
    @WithDefault("true")
    boolean openMetrics();
}
