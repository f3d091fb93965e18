package org.slopewatch.security;

import java.util.Optional;

/**
 * Which role a request needs, in one place. The health endpoints stay open (probes carry no
 * token); the metrics endpoint is open unless configured otherwise; the dashboard's files are
 * open because they hold no data (the figures come from the API, which asks for a token); reads
 * of the API need the read role unless reads are open for a trusted network; anything that
 * changes state (quotes, acknowledgements, mutes, reloads, what-if jobs) needs the write role.
 */
public record AccessRule(boolean openReads, boolean openMetrics) {

    /** The role a request needs, or empty when it needs none. */
    public Optional<Role> needed(String method, String path) {
        boolean reading = "GET".equals(method) || "HEAD".equals(method) || "OPTIONS".equals(method);
        if (path.equals("/q/health") || path.startsWith("/q/health/")) {
            return Optional.empty();
        }
        if (path.equals("/q/metrics") || path.startsWith("/q/metrics/")) {
            return openMetrics ? Optional.empty() : Optional.of(Role.READ);
        }
        if (path.startsWith("/api/") || path.equals("/api") || path.startsWith("/q/")) {
            if (!reading) {
                return Optional.of(Role.WRITE);
            }
            return openReads ? Optional.empty() : Optional.of(Role.READ);
        }
        // the dashboard's static files and anything else outside the API: no data, no token
        return reading ? Optional.empty() : Optional.of(Role.WRITE);
    }
}
