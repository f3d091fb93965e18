package org.slopewatch.security;

import io.vertx.ext.web.RoutingContext;
import java.util.HexFormat;
import org.jboss.logging.Logger;
import org.slopewatch.text.Excerpt;

/**
 * One log line per change made through the API (acknowledgements, quiet periods, lifts, reloads,
 * what-if jobs), saying which token made it, from where, and what was answered, so that a
 * post-mortem can tell who changed the desk's state. A token is named by the first 12 hex digits
 * of its SHA-256, which an operator finds at the start of the {@code sha256:…} form of the
 * configured token, and never by the token itself. Quote submissions are left out: they come by
 * the thousand and the journal keeps each with its origin already.
 */
final class WriteAudit {

    private static final Logger LOG = Logger.getLogger(WriteAudit.class);

    private WriteAudit() {
    }

    /** Logs the change once it has been answered. */
    static void record(RoutingContext rc, String token) {
        String path = rc.request().path();
        if (path == null || path.startsWith("/api/quotes")) {
            return;
        }
        String method = rc.request().method().name();
        String who = fingerprint(token);
        String from = rc.request().remoteAddress() == null ? "?" : rc.request().remoteAddress().hostAddress();
        String shown = Excerpt.cut(path, Excerpt.MAX_CHARS);
        rc.addBodyEndHandler(v -> LOG.infof("api change %s %s by token sha256:%s… from %s answered %d", method, shown, who, from,
                rc.response().getStatusCode()));
    }

    /** The first 12 hex digits of the token's SHA-256. */
    static String fingerprint(String token) {
        return HexFormat.of().formatHex(TokenBook.sha256(token)).substring(0, 12);
    }
}
