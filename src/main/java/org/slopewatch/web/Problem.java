package org.slopewatch.web;

import com.fasterxml.jackson.annotation.JsonAnyGetter;
import com.fasterxml.jackson.annotation.JsonIgnore;
import com.fasterxml.jackson.annotation.JsonPropertyOrder;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import org.eclipse.microprofile.openapi.annotations.enums.SchemaType;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.media.SchemaProperty;
import org.slopewatch.text.Excerpt;

/**
 * The body of every error answer of the HTTP API, an RFC 9457 problem document sent as
 * {@value #MEDIA_TYPE}: the five members of section 3.1 and, where a kind has more to say,
 * extension members (section 3.2) written as they are given, in snake case like the rest of the
 * API. The resources throw a {@link ProblemException} and {@link ProblemMapper} writes this;
 * the access filter, which answers before the REST layer, writes the same record with the same
 * object mapper.
 *
 * @param type     the kind's URI ({@link ProblemType#uri()}), or {@code about:blank} for a status no kind has
 * @param title    the kind's title, the same for every occurrence
 * @param status   the HTTP status of the answer
 * @param detail   what went wrong this time, never empty; repeats input only as an excerpt
 * @param instance the request's path as it was sent (cut like any repeated input)
 */
@JsonPropertyOrder({"type", "title", "status", "detail", "instance"})
@Schema(name = "Problem", description = "An RFC 9457 problem document (application/problem+json). Extension members by type: "
        + "quotes-rejected, too-large and unavailable on POST /api/quotes carry the quote answer's processed, accepted, duplicates, "
        + "rejected, transitions and errors; invalid-policy carries problems, line and column; invalid-history and invalid-body "
        + "(for JSON that does not parse) line and column; policy-rejected result and hash.",
        requiredProperties = {"type", "title", "status", "detail", "instance"}, additionalProperties = Schema.True.class,
        properties = {
                @SchemaProperty(name = "line", type = SchemaType.INTEGER, description = "line of the first problem, from 1"),
                @SchemaProperty(name = "column", type = SchemaType.INTEGER, description = "column of the first problem, from 1"),
                @SchemaProperty(name = "problems", type = SchemaType.ARRAY, implementation = String.class,
                        description = "every problem found, as file:line:column: message"),
                @SchemaProperty(name = "errors", type = SchemaType.ARRAY, implementation = IngestAnswer.Error.class,
                        description = "the first rejected quote messages")})
public record Problem(
        @Schema(description = "the problem's kind: /problems/<kind>, a reference relative to the daemon (see docs/api.md)",
                example = "/problems/not-found") String type,
        @Schema(description = "the kind's summary, the same for every occurrence", example = "Not found") String title,
        @Schema(description = "the HTTP status of this answer", example = "404") int status,
        @Schema(description = "what went wrong this time", example = "no spread GOVT-A:30Y-7Y") String detail,
        @Schema(description = "the path of the request, as sent", example = "/api/spreads/GOVT-A:30Y-7Y") String instance,
        @JsonIgnore @Schema(hidden = true) Map<String, Object> extensions) {

    public static final String MEDIA_TYPE = "application/problem+json";

    /** The members of section 3.1, which an extension may not shadow. */
    private static final Set<String> MEMBERS = Set.of("type", "title", "status", "detail", "instance");

    public Problem {
        if (detail == null || detail.isBlank()) {
            throw new IllegalArgumentException("a problem says what went wrong");
        }
        for (String name : extensions.keySet()) {
            if (MEMBERS.contains(name)) {
                throw new IllegalArgumentException("extension member '" + name + "' would shadow a member of RFC 9457 section 3.1");
            }
        }
        extensions = Collections.unmodifiableMap(new LinkedHashMap<>(extensions));
    }

    /** A problem of a kind, about the request with this (raw) path. */
    public static Problem of(ProblemType kind, String detail, String path, Map<String, Object> extensions) {
        return new Problem(kind.uri(), kind.title(), kind.status(), detail, instance(path), extensions);
    }

    public static Problem of(ProblemType kind, String detail, String path) {
        return of(kind, detail, path, Map.of());
    }

    /** A status no kind has: {@code about:blank} with the status phrase as title (RFC 9457 section 4.2.1). */
    static Problem blank(int status, String phrase, String detail, String path) {
        return new Problem("about:blank", phrase, status, detail, instance(path), Map.of());
    }

    /** The extension members, written after the five (Jackson's any-getter). */
    @JsonAnyGetter
    Map<String, Object> extensionMembers() {
        return extensions;
    }

    private static String instance(String path) {
        return path == null || path.isEmpty() ? "/" : Excerpt.cut(path, Excerpt.MAX_CHARS);
    }
}
