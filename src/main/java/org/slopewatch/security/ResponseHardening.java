package org.slopewatch.security;

import io.vertx.core.MultiMap;
import io.vertx.ext.web.Router;
import io.vertx.ext.web.RoutingContext;
import jakarta.enterprise.event.Observes;
import jakarta.inject.Singleton;

/**
 * Headers every answer carries, refusals included, so that a browser treats the daemon's output
 * as what it says it is: no content-type sniffing, no framing by another site, no referrer leaving
 * with a dashboard link, scripts and styles only from the daemon itself (the report's inline
 * style sheet and SVG need {@code 'unsafe-inline'} styles and {@code data:} images, nothing
 * more), and no caching of desk data by browsers or proxies (the dashboard's three small files
 * are not cached either, so an upgrade shows at once).
 */
@Singleton
public class ResponseHardening {

    /** The dashboard loads its scripts and styles from the daemon; nothing else loads anything. */
    static final String CONTENT_SECURITY_POLICY = "default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; "
            + "img-src 'self' data:; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

    // ahead of the access filter (order -10,000), so that its refusals carry the headers too
    private static final int ORDER = -10_001;

    void install(@Observes Router router) {
        router.route().order(ORDER).handler(this::harden);
    }

    private void harden(RoutingContext rc) {
        rc.addHeadersEndHandler(v -> {
            MultiMap headers = rc.response().headers();
            headers.set("X-Content-Type-Options", "nosniff");
            headers.set("X-Frame-Options", "DENY");
            headers.set("Referrer-Policy", "no-referrer");
            headers.set("Content-Security-Policy", CONTENT_SECURITY_POLICY);
            if (!headers.contains("Cache-Control")) {
                headers.set("Cache-Control", "no-store");
            }
        });
        rc.next();
    }
}
