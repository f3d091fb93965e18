package org.slopewatch.web;

import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.Context;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.UriInfo;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.journal.JournalRange;
import org.slopewatch.journal.TimelineRows;

/**
 * A spread's timeline: its observations, transitions, notices and what became of them, in the
 * order the journal learned them, a page at a time ({@link Paging}).
 */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class TimelineResource {

    /** Items a page holds at most, and unless {@code limit} says otherwise. */
    static final int MAX_ITEMS = 10_000;

    /**
     * A page of the timeline of a spread in a market-date range as the journal held it at
     * {@code as_of} (null: now), with the rule set in force then; {@code next} is where the rest
     * is when {@code truncated}.
     */
    public record TimelineView(String spread, LocalDate from, LocalDate to, Instant asOf, String policyHash, boolean truncated,
                               String next, List<TimelineItem> items) {
    }

    private final TimelineRows rows;
    private final RuleSetAt ruleSets;

    TimelineResource(TimelineRows rows, RuleSetAt ruleSets) {
        this.rows = rows;
        this.ruleSets = ruleSets;
    }

    @GET
    @Path("/spreads/{id}/timeline")
    @Operation(summary = "Observations, transitions (superseded ones marked), alerts, delivery attempts and acknowledgements of a spread "
            + "in recorded order; with as_of, as the journal held them then")
    @APIResponse(responseCode = "200", description = "the timeline",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = TimelineView.class)))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id, a date or as_of cannot be read, limit not a whole "
            + "number from 1, or after not a cursor of this list")
    public RestResponse<TimelineView> timeline(@PathParam("id") String id, @QueryParam("from") String from, @QueryParam("to") String to,
                                               @QueryParam("as_of") String asOf, @QueryParam("limit") String limit,
                                               @QueryParam("after") String after, @Context UriInfo uri) {
        String spread = QueryParams.spread(id).id();
        LocalDate fromDate = QueryParams.date(from, null);
        LocalDate toDate = QueryParams.date(to, null);
        Instant at = QueryParams.asOf(asOf);
        int n = Paging.limit(limit, MAX_ITEMS, MAX_ITEMS);
        TimelineRows.Position position = Cursors.timeline(after);
        JournalRange range = new JournalRange(spread, fromDate == null ? QueryParams.EARLIEST : fromDate,
                toDate == null ? QueryParams.LATEST : toDate, at);
        // each kind's first n + 1 rows after the cursor hold every row of the merged page and the one that tells more follow
        List<SpreadTimeline.Entry> merged = SpreadTimeline.merge(rows.observations(range, position, n + 1),
                rows.transitions(range, position, n + 1), rows.alerts(range, position, n + 1), rows.attempts(range, position, n + 1),
                rows.acks(range, position, n + 1));
        Paging.Page<SpreadTimeline.Entry> page = Paging.Page.of(merged, n, e -> Cursors.timeline(e.position()));
        String next = Paging.next(uri, page);
        return Paging.answer(new TimelineView(spread, fromDate, toDate, at, ruleSets.hash(at), page.truncated(), next,
                page.items().stream().map(SpreadTimeline.Entry::item).toList()), next);
    }
}
