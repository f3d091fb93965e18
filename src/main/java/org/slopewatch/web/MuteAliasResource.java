package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.DELETE;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.Context;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import jakarta.ws.rs.core.UriBuilder;
import jakarta.ws.rs.core.UriInfo;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.journal.QuietPeriodBook;

/**
 * {@code /api/mutes}, the path quiet periods had before, kept for one release with its old fields
 * (vocabulary: deprecation path): {@code {rule|spread, duration|until, reason, by}} in, the old
 * shapes out, lifts with {@code ?by=}. Every answer, problems included, says it is deprecated
 * ({@link Superseded}); the checks, the paging and the journal are those of
 * {@link QuietPeriodResource}, to which each request is handed in the new fields.
 */
@Path("/api/mutes")
@Produces(MediaType.APPLICATION_JSON)
@Superseded
public class MuteAliasResource {

    private final QuietPeriodResource quietPeriods;
    private final Clock clock;

    MuteAliasResource(QuietPeriodResource quietPeriods, Clock clock) {
        this.quietPeriods = quietPeriods;
        this.clock = clock;
    }

    /** The old request: {@code duration} is the new {@code lasts}, {@code reason} the new {@code note}, {@code by} the new {@code set_by}. */
    public record MuteRequest(String rule, String spread, String duration, String until, String reason, String by) {
    }

    /** A quiet period in the old fields: {@code kind} rule or spread, {@code target} its name. */
    public record MuteView(long id, String kind, String target, Instant until, String reason, String by, Instant createdAt,
                           boolean active) {

        static MuteView of(QuietPeriodBook.QuietPeriod q, Instant now) {
            return new MuteView(q.id(), q.kind(), q.target(), q.until(), q.note(), q.setBy(), q.setAt(), q.activeAt(now));
        }
    }

    @GET
    @Operation(summary = "Deprecated: GET /api/quiet-periods", deprecated = true)
    @APIResponse(responseCode = "200", description = "a page of quiet periods in the old fields, newest first")
    @APIResponse(responseCode = "400", description = "invalid-parameter: limit not a whole number from 1, after not a cursor of this list")
    public RestResponse<List<MuteView>> list(@QueryParam("limit") String limit, @QueryParam("after") String after, @Context UriInfo uri) {
        return quietPeriods.page(limit, after, uri, MuteView::of);
    }

    @GET
    @Path("/{id}")
    @Operation(summary = "Deprecated: GET /api/quiet-periods/{id}", deprecated = true)
    @APIResponse(responseCode = "200", description = "the quiet period in the old fields")
    @APIResponse(responseCode = "404", description = "not-found: no quiet period with this id")
    public MuteView one(@PathParam("id") long id) {
        Instant now = clock.instant();
        return quietPeriods.kept(id).map(q -> MuteView.of(q, now)).orElseThrow(() -> ProblemException.notFound("no quiet period " + id));
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Deprecated: POST /api/quiet-periods", deprecated = true)
    @APIResponse(responseCode = "201", description = "the quiet period set, in the old fields")
    @APIResponse(responseCode = "400", description = "invalid-body: as POST /api/quiet-periods")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: the body is not application/json")
    public Response mute(MuteRequest r) {
        QuietPeriodBook.QuietPeriod q = quietPeriods.keep(r == null ? null
                : new QuietPeriodResource.QuietPeriodRequest(r.rule(), r.spread(), r.duration(), r.until(), r.reason(), r.by()));
        return Response.created(UriBuilder.fromPath("/api/mutes/{id}").build(q.id())).entity(MuteView.of(q, clock.instant())).build();
    }

    @DELETE
    @Path("/{id}")
    @Operation(summary = "Deprecated: DELETE /api/quiet-periods/{id}?lifted_by=", deprecated = true)
    @APIResponse(responseCode = "204", description = "lifted")
    @APIResponse(responseCode = "400", description = "invalid-parameter: no by, or one too long or holding a control character")
    @APIResponse(responseCode = "404", description = "not-found: no active quiet period with this id (or an id that is not a number)")
    public Response lift(@PathParam("id") long id, @QueryParam("by") String by) {
        quietPeriods.liftAs(id, by, "by");
        return Response.noContent().build();
    }
}
