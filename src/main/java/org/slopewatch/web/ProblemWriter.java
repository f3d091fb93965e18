package org.slopewatch.web;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.vertx.core.buffer.Buffer;
import io.vertx.ext.web.RoutingContext;
import jakarta.inject.Singleton;
import java.util.Map;
import org.jboss.logging.Logger;

/**
 * Writes a {@link Problem} as the API's JSON (the application's object mapper, snake case), for
 * the REST layer's answers ({@link ProblemMapper}) and for the route handlers that answer before
 * it (the access filter, {@link BodyLimit}), so that every error body is written one way.
 */
@Singleton
public class ProblemWriter {

    private static final Logger LOG = Logger.getLogger(ProblemWriter.class);

    private final ObjectMapper json;

    ProblemWriter(ObjectMapper json) {
        this.json = json;
    }

    /** The problem document's bytes. */
    public byte[] bytes(Problem problem) {
        try {
            return json.writeValueAsBytes(problem);
        } catch (JsonProcessingException e) {
            // an extension member Jackson cannot write is a bug of ours: answered without the extensions rather than not at all
            LOG.errorf(e, "cannot write the extension members of the problem %s", problem.type());
            try {
                return json.writeValueAsBytes(new Problem(problem.type(), problem.title(), problem.status(), problem.detail(),
                        problem.instance(), Map.of()));
            } catch (JsonProcessingException plain) {
                throw new IllegalStateException("cannot write a problem document", plain);
            }
        }
    }

    /** Ends the response of a route handler with the problem: its status, the media type and the document. */
    public void send(RoutingContext rc, Problem problem) {
        rc.response().setStatusCode(problem.status()).putHeader("Content-Type", Problem.MEDIA_TYPE).end(Buffer.buffer(bytes(problem)));
    }
}
