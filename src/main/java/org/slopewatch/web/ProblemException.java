package org.slopewatch.web;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The one way a resource answers with an error: the kind, what went wrong and any extension
 * members; {@link ProblemMapper} turns it into a {@link Problem} about the request's path. It
 * carries no stack trace: it is an answer, not a failure of the daemon.
 */
public final class ProblemException extends RuntimeException {

    private final transient ProblemType kind;
    private final transient Map<String, Object> extensions;

    public ProblemException(ProblemType kind, String detail, Map<String, Object> extensions) {
        super(detail, null, false, false);
        this.kind = kind;
        this.extensions = Collections.unmodifiableMap(new LinkedHashMap<>(extensions)); // in the order given, as written
    }

    public ProblemException(ProblemType kind, String detail) {
        this(kind, detail, Map.of());
    }

    static ProblemException notFound(String detail) {
        return new ProblemException(ProblemType.NOT_FOUND, detail);
    }

    static ProblemException invalidParameter(String detail) {
        return new ProblemException(ProblemType.INVALID_PARAMETER, detail);
    }

    static ProblemException invalidBody(String detail) {
        return new ProblemException(ProblemType.INVALID_BODY, detail);
    }

    public ProblemType kind() {
        return kind;
    }

    /** The problem document about the request with this raw path. */
    Problem problem(String path) {
        return Problem.of(kind, getMessage(), path, extensions);
    }
}
