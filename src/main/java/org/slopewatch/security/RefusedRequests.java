package org.slopewatch.security;

import io.vertx.core.http.impl.HttpServerRequestInternal;
import io.vertx.ext.web.RoutingContext;

/**
 * Puts every request the access filter refuses under one {@code uri} label of the
 * {@code http_server_requests} metric, {@value #TEMPLATE}.
 *
 * <p>Quarkus's Micrometer binder takes a request's {@code uri} label from the URL path template
 * that the REST layer leaves in the request's Vert.x context under the key {@value #KEY}
 * (quarkus-micrometer's {@code HttpRequestMetric} reads it; quarkus-rest's
 * {@code ObservabilityUtil} writes it). A refused request never reaches the REST layer, so there
 * is no template, and for a 4xx answer without one the binder falls back to the raw path (404
 * alone becomes {@code NOT_FOUND}). Without this, every junk path an anonymous client tries would
 * become a series of its own, until the binder's cap on distinct {@code uri} values
 * ({@code quarkus.micrometer.binder.http-server.max-uri-tags}, 100) is used up and the real
 * endpoints are no longer recorded. {@code RefusedRequestMetricsTest} fails if Quarkus stops
 * reading the key.
 */
final class RefusedRequests {

    static final String KEY = "UrlPathTemplate";
    static final String TEMPLATE = "/refused";

    private RefusedRequests() {
    }

    static void label(RoutingContext rc) {
        if (rc.request() instanceof HttpServerRequestInternal request) {
            request.context().putLocal(KEY, TEMPLATE);
        }
    }
}
