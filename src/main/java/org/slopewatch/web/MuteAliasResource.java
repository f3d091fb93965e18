package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.DELETE;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import java.time.Clock;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.journal.QuietPeriodBook;

/**
 * {@code /api/mutes}, the path quiet periods had before, kept for one release with its old fields
 * (vocabulary: deprecation path): {@code {rule|spread, duration|until, reason, by}} in, the old
 * shapes out, lifts with {@code ?by=}. Every answer carries {@code Deprecation: true} and
 * {@code Link: </api/quiet-periods>; rel="successor-version"}; the checks and the journal are
 * those of {@link QuietPeriodResource}, to which each request is handed in the new fields.
 */
@Path("/api/mutes")
@Produces(MediaType.APPLICATION_JSON)
public class MuteAliasResource {

    static final String SUCCESSOR = "</api/quiet-periods>; rel=\"successor-version\"";

    private final QuietPeriodResource quietPeriods;
    private final AlertDesk desk;
    private final Clock clock;

    MuteAliasResource(QuietPeriodResource quietPeriods, AlertDesk desk, Clock clock) {
        this.quietPeriods = quietPeriods;
        this.desk = desk;
        this.clock = clock;
    }

    /** The old request: {@code duration} is the new {@code lasts}, {@code reason} the new {@code note}, {@code by} the new {@code set_by}. */
    public record MuteRequest(String rule, String spread, String duration, String until, String reason, String by) {
    }

    @GET
    @Operation(summary = "Deprecated: GET /api/quiet-periods", deprecated = true)
    public Response list() {
        Instant now = clock.instant();
        List<Map<String, Object>> out = desk.quietPeriods().stream().map(q -> old(q, now)).toList();
        return deprecated(Response.ok(out)).build();
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Deprecated: POST /api/quiet-periods", deprecated = true)
    public Response mute(MuteRequest r) {
        Response answer = quietPeriods.set(r == null ? null
                : new QuietPeriodResource.QuietPeriodRequest(r.rule(), r.spread(), r.duration(), r.until(), r.reason(), r.by()));
        if (answer.getEntity() instanceof QuietPeriodResource.QuietPeriodView v) {
            Map<String, Object> created = new LinkedHashMap<>();
            created.put("id", v.id());
            created.put("kind", v.rule() != null ? "rule" : "spread");
            created.put("target", v.rule() != null ? v.rule() : v.spread());
            created.put("until", v.until());
            created.put("reason", v.note());
            created.put("by", v.setBy());
            return deprecated(Response.status(answer.getStatus()).entity(created)).build();
        }
        return deprecated(Response.fromResponse(answer)).build();
    }

    @DELETE
    @Path("/{id}")
    @Operation(summary = "Deprecated: DELETE /api/quiet-periods/{id}?lifted_by=", deprecated = true)
    public Response lift(@PathParam("id") long id, @QueryParam("by") String by) {
        return deprecated(Response.fromResponse(quietPeriods.lift(id, by))).build();
    }

    private static Map<String, Object> old(QuietPeriodBook.QuietPeriod q, Instant now) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("id", q.id());
        m.put("kind", q.kind());
        m.put("target", q.target());
        m.put("until", q.until());
        m.put("reason", q.note());
        m.put("by", q.setBy());
        m.put("created_at", q.setAt());
        m.put("active", q.activeAt(now));
        return m;
    }

    private static Response.ResponseBuilder deprecated(Response.ResponseBuilder b) {
        return b.header("Deprecation", "true").header("Link", SUCCESSOR);
    }
}
