package org.slopewatch.web;

import io.quarkus.runtime.configuration.MemorySize;
import io.vertx.ext.web.Router;
import io.vertx.ext.web.RoutingContext;
import jakarta.enterprise.event.Observes;
import jakarta.inject.Singleton;
import org.eclipse.microprofile.config.inject.ConfigProperty;

/**
 * Refuses a request whose declared body is larger than {@code quarkus.http.limits.max-body-size}
 * with a 413 problem document, just before Quarkus's own check (route order -2), which would
 * answer the same status with an empty body. A body without a declared length (chunked) that
 * grows past the limit is still cut off by Quarkus as it is read, and a request that asked
 * {@code Expect: 100-continue} still gets Quarkus's empty 413.
 */
@Singleton
public class BodyLimit {

    // after the access filter (-10,000), so that an anonymous client learns nothing of the limit; before Quarkus's check (-2)
    private static final int ORDER = -3;

    private final long max;
    private final ProblemWriter problems;

    BodyLimit(@ConfigProperty(name = "quarkus.http.limits.max-body-size") MemorySize max, ProblemWriter problems) {
        this.max = max.asLongValue();
        this.problems = problems;
    }

    void install(@Observes Router router) {
        router.route().order(ORDER).handler(this::check);
    }

    private void check(RoutingContext rc) {
        String length = rc.request().getHeader("Content-Length");
        long declared;
        try {
            declared = length == null ? -1 : Long.parseLong(length.strip());
        } catch (NumberFormatException e) {
            declared = -1; // the HTTP codec refuses a malformed length before any route sees it
        }
        if (declared <= max || rc.request().getHeader("Expect") != null) {
            // a request that asked Expect: 100-continue is left to Quarkus's check and its empty 413: answered here (a body,
            // then the connection closed), the JDK's HTTP client of HostileInputTest waited for ever; why is not known yet
            rc.next();
            return;
        }
        // as Quarkus's check does: the rest of the body is not read, so the connection cannot serve another request and is
        // closed once the answer is out (a client still sending, having asked Expect: 100-continue or not, stops there)
        rc.response().putHeader("Connection", "close").endHandler(v -> rc.request().connection().close());
        problems.send(rc, Problem.of(ProblemType.TOO_LARGE, "the body is " + declared + " bytes; at most " + max
                + " are taken (quarkus.http.limits.max-body-size): nothing was read", rc.request().path()));
    }
}
