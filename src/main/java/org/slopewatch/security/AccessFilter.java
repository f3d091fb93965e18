package org.slopewatch.security;

import io.quarkus.runtime.Startup;
import io.vertx.ext.web.Router;
import io.vertx.ext.web.RoutingContext;
import jakarta.enterprise.event.Observes;
import jakarta.inject.Singleton;
import java.util.List;
import java.util.Optional;
import org.jboss.logging.Logger;
import org.slopewatch.web.Problem;
import org.slopewatch.web.ProblemType;
import org.slopewatch.web.ProblemWriter;

/**
 * Applies the {@link AccessRule} to every HTTP request, on its raw path, before the API, the
 * metrics or the dashboard's files see it: a matrix parameter is 400, no token or an unknown one
 * is 401, a read token asking to write is 403. Answers are the API's problem documents
 * ({@link Problem}, written here because the filter answers before the REST layer), say why in a
 * few words and never repeat the token, and are counted in the HTTP metrics under one label ({@link RefusedRequests}). Changes
 * that pass are logged with the token's fingerprint ({@link WriteAudit}). With
 * security on and no write token configured, start-up stops: a daemon nobody can feed is a
 * misconfiguration, not a mode.
 */
@Startup
@Singleton
public class AccessFilter {

    private static final Logger LOG = Logger.getLogger(AccessFilter.class);
    // ahead of every route Quarkus registers (health, metrics, REST, static files)
    private static final int FIRST = -10_000;

    private final boolean enabled;
    private final AccessRule rule;
    private final TokenBook tokens;
    private final ProblemWriter problems;

    AccessFilter(SecurityConfig config, ProblemWriter problems) {
        this.problems = problems;
        this.enabled = config.enabled();
        this.rule = new AccessRule(config.openReads(), config.openMetrics());
        try {
            this.tokens = TokenBook.of(config.readTokens().orElse(List.of()), config.writeTokens().orElse(List.of()));
        } catch (IllegalArgumentException e) {
            throw new IllegalStateException("slopewatch.security: " + e.getMessage(), e);
        }
        if (enabled && !tokens.hasWriteToken()) {
            throw new IllegalStateException("no write token configured: set slopewatch.security.write-tokens (e.g. the environment "
                    + "variable SLOPEWATCH_SECURITY_WRITE_TOKENS) to one or more tokens of at least 16 characters, or "
                    + "sha256:<hex> of them; or slopewatch.security.enabled=false on a closed network");
        }
        if (!enabled) {
            LOG.warn("slopewatch.security.enabled=false: the API accepts every request without a token");
        }
    }

    void install(@Observes Router router) {
        router.route().order(FIRST).handler(this::check);
    }

    private void check(RoutingContext rc) {
        if (!enabled) {
            rc.next();
            return;
        }
        // the raw path: what the client sent, before any layer decodes or normalises it
        Access needed = rule.needed(rc.request().method().name(), rc.request().path());
        if (needed instanceof Access.Open) {
            rc.next();
            return;
        }
        if (needed instanceof Access.Malformed malformed) {
            refuse(rc, ProblemType.MALFORMED_PATH, malformed.reason());
            return;
        }
        Role role = ((Access.Token) needed).role();
        String header = rc.request().getHeader("Authorization");
        String what = role == Role.WRITE ? "a token with the write role" : "a token with the read role";
        if (header == null || !header.regionMatches(true, 0, "Bearer ", 0, 7) || header.length() <= 7) {
            refuse(rc, ProblemType.UNAUTHORIZED, "this request needs " + what + " (Authorization: Bearer <token>)");
            return;
        }
        String token = header.substring(7).strip();
        Optional<Role> presented = tokens.roleOf(token);
        if (presented.isEmpty()) {
            refuse(rc, ProblemType.UNAUTHORIZED, "the bearer token is not valid");
        } else if (!presented.get().covers(role)) {
            refuse(rc, ProblemType.FORBIDDEN, "this token may read but not change anything; this request needs " + what);
        } else {
            if (role == Role.WRITE) {
                WriteAudit.record(rc, token);
            }
            rc.next();
        }
    }

    private void refuse(RoutingContext rc, ProblemType kind, String reason) {
        RefusedRequests.label(rc);
        if (kind == ProblemType.UNAUTHORIZED) {
            rc.response().putHeader("WWW-Authenticate", "Bearer realm=\"slopewatch\"");
        }
        problems.send(rc, Problem.of(kind, reason, rc.request().path()));
    }
}
