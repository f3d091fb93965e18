package org.slopewatch.web;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import io.vertx.core.http.HttpServerRequest;
import jakarta.ws.rs.WebApplicationException;
import jakarta.ws.rs.core.HttpHeaders;
import jakarta.ws.rs.core.Response;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.jboss.logging.Logger;
import org.jboss.resteasy.reactive.server.ServerExceptionMapper;
import org.slopewatch.text.Excerpt;

/**
 * Every error the REST layer answers, as a {@link Problem}: what a resource throws
 * ({@link ProblemException}), what the REST layer raises itself (no such method on a route, a media
 * type it does not take or cannot answer in, a parameter it cannot convert, a body that is not
 * JSON), and any other failure, which is a 500 with a generic detail: the exception is logged,
 * never sent.
 */
class ProblemMapper {

    private static final Logger LOG = Logger.getLogger(ProblemMapper.class);
    /** Headers of the REST layer's own answer that a problem answer keeps (RFC 9110: a 405 lists the methods in Allow). */
    private static final List<String> KEPT_HEADERS = List.of(HttpHeaders.ALLOW, HttpHeaders.WWW_AUTHENTICATE, HttpHeaders.RETRY_AFTER);

    /** The detail of a failure of the daemon: what failed stays in the log, which masks secrets (ops.LogGuard). */
    private static final String GENERIC = "the daemon failed to answer this request; the failure is in its log";

    private final ProblemWriter writer;

    ProblemMapper(ProblemWriter writer) {
        this.writer = writer;
    }

    @ServerExceptionMapper
    Response problem(ProblemException e, HttpServerRequest request) {
        return answer(e.problem(request.path())).build();
    }

    @ServerExceptionMapper
    Response framework(WebApplicationException e, HttpServerRequest request) {
        JsonProcessingException unreadable = cause(e, JsonProcessingException.class);
        if (unreadable != null) {
            return unreadableBody(unreadable, request);
        }
        Response given = e.getResponse();
        int status = given.getStatus();
        ProblemType kind = ProblemType.forStatus(status);
        String detail;
        if (status >= 500) {
            LOG.errorf(e, "failed to answer %s %s", request.method().name(), Excerpt.cut(request.path(), Excerpt.MAX_CHARS));
            detail = GENERIC;
        } else {
            detail = detail(status, e, request);
        }
        Problem problem = kind != null ? Problem.of(kind, detail, request.path())
                : Problem.blank(status, given.getStatusInfo().getReasonPhrase(), detail, request.path());
        Response.ResponseBuilder answer = answer(problem);
        for (String header : KEPT_HEADERS) {
            for (Object value : given.getHeaders().getOrDefault(header, List.of())) {
                answer.header(header, value);
            }
        }
        return answer.build();
    }

    /** Jackson's own exceptions, those the REST layer's JSON reader lets through (the most specific class it maps too). */
    @ServerExceptionMapper({JsonProcessingException.class, MismatchedInputException.class})
    Response unreadableBody(JsonProcessingException e, HttpServerRequest request) {
        Map<String, Object> place = new LinkedHashMap<>();
        JsonLocation at = e.getLocation();
        if (at != null && at.getLineNr() > 0 && at.getColumnNr() > 0) {
            place.put("line", at.getLineNr());
            place.put("column", at.getColumnNr());
        }
        return answer(Problem.of(ProblemType.INVALID_BODY, unreadable(e), request.path(), place)).build();
    }

    @ServerExceptionMapper
    Response unexpected(Throwable e, HttpServerRequest request) {
        LOG.errorf(e, "failed to answer %s %s", request.method().name(), Excerpt.cut(request.path(), Excerpt.MAX_CHARS));
        return answer(Problem.of(ProblemType.INTERNAL, GENERIC, request.path())).build();
    }

    private Response.ResponseBuilder answer(Problem problem) {
        return Response.status(problem.status()).type(Problem.MEDIA_TYPE).entity(writer.bytes(problem));
    }

    private static String detail(int status, WebApplicationException e, HttpServerRequest request) {
        return switch (status) {
            case 404 -> e.getCause() == null ? "nothing is found at this path"
                    // the REST layer answers 404 to a path or query parameter it cannot convert (Jakarta REST 3.1, section 3.2)
                    : "a path or query parameter is not of the type this route takes: " + Excerpt.cut(e.getCause().getMessage(), Excerpt.MAX_CHARS);
            case 405 -> "this path does not take " + request.method().name() + (e.getResponse().getAllowedMethods().isEmpty()
                    ? " (the methods of each path are in /q/openapi)"
                    : "; it takes " + e.getResponse().getAllowedMethods().stream().sorted().collect(Collectors.joining(", ")));
            case 406 -> "this route cannot answer in a media type that Accept: " + Excerpt.quoted(request.getHeader(HttpHeaders.ACCEPT))
                    + " takes (the media types of each route are in /q/openapi)";
            case 415 -> "this route does not take a body of type " + Excerpt.quoted(request.getHeader(HttpHeaders.CONTENT_TYPE))
                    + " (the media types of each route are in /q/openapi)";
            default -> "the request was refused: " + e.getResponse().getStatusInfo().getReasonPhrase();
        };
    }

    /** What is wrong with a JSON body, without Jackson's names of our classes. */
    private static String unreadable(JsonProcessingException e) {
        String start = "the body is not the JSON this route takes";
        if (e instanceof JsonMappingException m && !m.getPath().isEmpty()) {
            String member = m.getPath().stream().map(r -> r.getFieldName() != null ? r.getFieldName() : "[" + r.getIndex() + "]")
                    .collect(Collectors.joining("."));
            return start + ": member " + Excerpt.quoted(member) + " is not of the type or shape expected (see /q/openapi)";
        }
        if (e instanceof JsonMappingException) {
            return start + " (see /q/openapi)";
        }
        return start + ": " + Excerpt.cut(e.getOriginalMessage(), Excerpt.MAX_CHARS);
    }

    private static <T extends Throwable> T cause(Throwable e, Class<T> type) {
        for (Throwable c = e.getCause(); c != null && c != e; c = c.getCause()) {
            if (type.isInstance(c)) {
                return type.cast(c);
            }
        }
        return null;
    }
}
