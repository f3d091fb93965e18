package org.slopewatch.security;

import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;

/**
 * Which request needs which role, in one place, decided on the raw path ({@link RawPath}: as
 * it arrived, not decoded, not normalised) and denying by default.
 *
 * <p>Open, for GET, HEAD and OPTIONS and only when the raw path is exactly one of these: the
 * health endpoints ({@link #HEALTH}: probes carry no token); {@code /q/metrics} unless
 * configured otherwise; the dashboard's files ({@link #DASHBOARD}: they hold no data, the figures
 * come from the API). Every other path, however spelled, needs the read role for GET, HEAD and
 * OPTIONS and the write role for any other method; a spelling of an open path that is not exactly
 * that path (an escape, a dot segment, a doubled slash, a different case) is simply not open.
 *
 * <p>Open reads, for a trusted network, let reads of the API ({@code /api/...} and
 * {@code /q/openapi}) through without a token, but only when the raw path is in normal form, so
 * that no spelling of another path (closed metrics, say) can pass for an API path.
 *
 * <p>A path with a semicolon, raw or escaped as {@code %3B}, is malformed whatever the token: it
 * is a matrix parameter, which no route of ours takes, and which the layers behind the filter read
 * differently (the REST layer answers {@code /api;x/spreads} as {@code /api/spreads}, the router
 * and the static files see another path), so such a path could only ever be misjudged.
 */
public record AccessRule(boolean openReads, boolean openMetrics) {

    /** The health endpoints of SmallRye Health with the groups this daemon uses (liveness, readiness, start-up, wellness). */
    public static final Set<String> HEALTH = Set.of("/q/health", "/q/health/live", "/q/health/ready", "/q/health/started", "/q/health/well");

    /**
     * The dashboard: {@code /} and every file under {@code src/main/resources/META-INF/resources/}
     * ({@code AccessRuleTest} fails when a file there is missing from this list or the other way round).
     */
    public static final Set<String> DASHBOARD = Set.of("/", "/index.html", "/dashboard.css", "/dashboard.js", "/charts.js");

    public static final String METRICS = "/q/metrics";

    private static final String OPENAPI = "/q/openapi";

    /** What a request with this method and raw path needs. */
    public Access needed(String method, String rawPath) {
        if (rawPath == null) {
            // Vert.x always gives a path; should one ever be missing, nothing about it is known
            return new Access.Token(Role.WRITE);
        }
        if (rawPath.indexOf(';') >= 0 || rawPath.toLowerCase(Locale.ROOT).contains("%3b")) {
            return new Access.Malformed("no path here takes matrix parameters (';')");
        }
        boolean reading = "GET".equals(method) || "HEAD".equals(method) || "OPTIONS".equals(method);
        if (!reading) {
            return new Access.Token(Role.WRITE);
        }
        if (HEALTH.contains(rawPath) || DASHBOARD.contains(rawPath) || (openMetrics && METRICS.equals(rawPath))) {
            return new Access.Open();
        }
        if (openReads && RawPath.isNormal(rawPath) && (rawPath.startsWith("/api/") || rawPath.equals(OPENAPI))) {
            return new Access.Open();
        }
        return new Access.Token(Role.READ);
    }

    /** Every path open to a read without a token (open reads aside), spelled exactly as it must arrive: the list for tests and docs. */
    public Set<String> openPaths() {
        Set<String> open = new TreeSet<>(HEALTH);
        open.addAll(DASHBOARD);
        if (openMetrics) {
            open.add(METRICS);
        }
        return open;
    }
}
