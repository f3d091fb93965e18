package org.slopewatch.web;

/**
 * The kinds of problem the HTTP API answers with, each with its {@code type} URI, its HTTP status
 * and its title (RFC 9457 sections 3.1.1 to 3.1.3). A kind always comes with the same status and
 * title; what differs between occurrences goes in {@code detail} and the extension members.
 * {@code docs/api.md} lists every kind (ErrorContractTest checks that each one answered is there).
 */
public enum ProblemType {

    /** A path or query parameter that is missing or cannot be read (a date, an instant, a spread id, a format). */
    INVALID_PARAMETER("invalid-parameter", 400, "Invalid parameter"),
    /** A request body that is not the JSON the route takes, or whose fields fail their checks (quiet periods, acknowledgements, what-ifs). */
    INVALID_BODY("invalid-body", 400, "Invalid request body"),
    /** A path with a matrix parameter ({@code ;}), refused before anything else looks at it. */
    MALFORMED_PATH("malformed-path", 400, "Malformed path"),
    /** A quote submission of which nothing was taken; {@code errors} lists the first rejects. */
    QUOTES_REJECTED("quotes-rejected", 400, "Quotes rejected"),
    /** A what-if's policy text with problems; {@code problems} lists them, {@code line} and {@code column} place the first. */
    INVALID_POLICY("invalid-policy", 400, "Invalid policy"),
    /** A what-if's history CSV that cannot be read; {@code line} and {@code column} place the problem. */
    INVALID_HISTORY("invalid-history", 400, "Invalid history"),
    /** No bearer token, or one that is not valid. */
    UNAUTHORIZED("unauthorized", 401, "Token required"),
    /** A token whose role does not cover the request (a read token asking to change something). */
    FORBIDDEN("forbidden", 403, "Role not sufficient"),
    /** Nothing at this path: an unknown spread, curve, alert, quiet period or what-if, or no route at all. */
    NOT_FOUND("not-found", 404, "Not found"),
    /** A route that exists but not for this method; the {@code Allow} header lists the methods it takes. */
    METHOD_NOT_ALLOWED("method-not-allowed", 405, "Method not allowed"),
    /** A route that cannot answer in any media type the {@code Accept} header takes. */
    NOT_ACCEPTABLE("not-acceptable", 406, "Not acceptable"),
    /** A request or a batch larger than the daemon takes; nothing of it was taken. */
    TOO_LARGE("too-large", 413, "Request too large"),
    /** A body of a media type the route does not take. */
    UNSUPPORTED_MEDIA_TYPE("unsupported-media-type", 415, "Unsupported media type"),
    /** The policy file on disk failed its checks on a reload; the policy in force keeps running. */
    POLICY_REJECTED("policy-rejected", 422, "Policy file rejected"),
    /** Too many requests of this kind at once (what-ifs queued to the limit); try again later. */
    BUSY("busy", 429, "Busy"),
    /** A failure of the daemon itself; the detail is generic and the failure is logged. */
    INTERNAL("internal", 500, "Internal error"),
    /** The daemon could not do it now (the pipeline did not answer in time); try again later. */
    UNAVAILABLE("unavailable", 503, "Unavailable");

    /** Where the type URIs live: relative references with the full path, as RFC 9457 section 3.1.1 recommends for relative ones. */
    static final String PREFIX = "/problems/";

    private final String name;
    private final int status;
    private final String title;

    ProblemType(String name, int status, String title) {
        this.name = name;
        this.status = status;
        this.title = title;
    }

    /** The {@code type} member: {@code /problems/not-found}. */
    public String uri() {
        return PREFIX + name;
    }

    public int status() {
        return status;
    }

    public String title() {
        return title;
    }

    /**
     * The kind for a status that the server raised without saying more (a route that does not
     * take the method, the media type, …), or null when no kind has that status.
     */
    static ProblemType forStatus(int status) {
        return switch (status) {
            case 400 -> INVALID_BODY;
            case 401 -> UNAUTHORIZED;
            case 403 -> FORBIDDEN;
            case 404 -> NOT_FOUND;
            case 405 -> METHOD_NOT_ALLOWED;
            case 406 -> NOT_ACCEPTABLE;
            case 413 -> TOO_LARGE;
            case 415 -> UNSUPPORTED_MEDIA_TYPE;
            case 429 -> BUSY;
            case 500 -> INTERNAL;
            case 503 -> UNAVAILABLE;
            default -> null;
        };
    }
}
