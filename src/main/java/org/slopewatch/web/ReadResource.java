package org.slopewatch.web;

import jakarta.ws.rs.DefaultValue;
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
import java.time.format.DateTimeParseException;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.JournalRange;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.pipeline.AsOfRebuild;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.ProbabilityModels;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.text.Excerpt;

/**
 * The read API: curves, spreads, their history, transitions and rejects. The history endpoints
 * take {@code as_of} (an instant) and then answer with what the journal held at that moment,
 * wrapped with that moment and the rule set in force then; without it they answer as before.
 * The lists that grow with the journal come a page at a time ({@link Paging}).
 */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class ReadResource {

    /** Items of a page of transitions, of a history (dates) and of rejects: what one answer may hold. */
    static final int MAX_ROWS = 10_000;
    /** Rejects a page holds unless {@code limit} says otherwise; the others default to the maximum. */
    static final int REJECTS_BY_DEFAULT = 100;

    private final QuotePipeline pipeline;
    private final JournalReader journal;
    private final PolicyHolder policies;
    private final RuleSetAt ruleSets;
    private final AsOfRebuild rebuild;

    ReadResource(QuotePipeline pipeline, JournalReader journal, PolicyHolder policies, RuleSetAt ruleSets) {
        this.pipeline = pipeline;
        this.journal = journal;
        this.policies = policies;
        this.ruleSets = ruleSets;
        this.rebuild = new AsOfRebuild(journal);
    }

    @GET
    @Path("/curves")
    @Operation(summary = "The latest snapshot of each curve, yields in basis points")
    public List<ApiViews.CurveView> curves() {
        return pipeline.latestCurves().stream().map(ApiViews.CurveView::of).toList();
    }

    @GET
    @Path("/curves/{curve}/{date}")
    @Operation(summary = "A curve's snapshot on one market date, yields in basis points")
    @APIResponse(responseCode = "200", description = "the snapshot")
    @APIResponse(responseCode = "400", description = "invalid-parameter: the date is not YYYY-MM-DD")
    @APIResponse(responseCode = "404", description = "not-found: no quotes for the curve on that date")
    public ApiViews.CurveView curve(@PathParam("curve") String curve, @PathParam("date") String date) {
        var snapshot = pipeline.curve(curve, date(date, null));
        if (snapshot == null) {
            throw ProblemException.notFound("no quotes for " + Excerpt.of(curve) + " on " + Excerpt.of(date));
        }
        return ApiViews.CurveView.of(snapshot);
    }

    @GET
    @Path("/curves/{curve}")
    @Operation(summary = "A curve's snapshot on the latest market date on or before a date (e.g. three months back, for comparison)")
    @APIResponse(responseCode = "200", description = "the snapshot")
    @APIResponse(responseCode = "400", description = "invalid-parameter: on_or_before missing or not YYYY-MM-DD")
    @APIResponse(responseCode = "404", description = "not-found: no quotes for the curve on or before that date")
    public ApiViews.CurveView curveOnOrBefore(@PathParam("curve") String curve, @QueryParam("on_or_before") String onOrBefore) {
        if (onOrBefore == null) {
            throw QueryParams.bad("give on_or_before=YYYY-MM-DD");
        }
        var snapshot = pipeline.curveOnOrBefore(curve, date(onOrBefore, null));
        if (snapshot == null) {
            throw ProblemException.notFound("no quotes for " + Excerpt.of(curve) + " on or before " + Excerpt.of(onOrBefore));
        }
        return ApiViews.CurveView.of(snapshot);
    }

    @GET
    @Path("/spreads")
    @Operation(summary = "Each spread's latest value, state, open spell and quarter-to-date average")
    public List<ApiViews.SpreadView> spreads() {
        ProbabilityModels models = policies.policy().probability();
        return pipeline.spreads().stream().map(s -> ApiViews.SpreadView.of(s, models)).toList();
    }

    @GET
    @Path("/spreads/{id}")
    @Operation(summary = "One spread's status; the id is CURVE:SPREAD, e.g. GOVT-A:10Y-3M. With asOf, its status at that moment, "
            + "rebuilt from the quotes recorded by then")
    @APIResponse(responseCode = "200", description = "the spread's status; with as_of, wrapped with the moment and the rule sets",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {ApiViews.SpreadView.class, ApiViews.SpreadAsOfView.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id is not CURVE:SPREAD, or as_of is not an instant")
    @APIResponse(responseCode = "404", description = "not-found: no such spread, or no value of it recorded by as_of")
    public Object spread(@PathParam("id") String id, @QueryParam("as_of") String asOf) {
        Instant at = QueryParams.asOf(asOf);
        if (at != null) {
            return spreadAsOf(key(id), at);
        }
        SpreadStatus s = pipeline.spread(key(id));
        if (s == null) {
            throw ProblemException.notFound("no spread " + Excerpt.of(id));
        }
        return ApiViews.SpreadView.of(s, policies.policy().probability());
    }

    @GET
    @Path("/spreads/{id}/spells")
    @Operation(summary = "A spread's ended spells, oldest first, with their figures as they stand after any revision; with as_of, "
            + "as they stood at that moment, rebuilt from the quotes recorded by then. The open spell is in the spread's status")
    @APIResponse(responseCode = "200", description = "the ended spells; with as_of, wrapped with the moment and the rule sets",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {ApiViews.SpellView[].class, ApiViews.SpellsAsOfView.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id is not CURVE:SPREAD, or as_of is not an instant")
    @APIResponse(responseCode = "404", description = "not-found: no such spread, or no value of it recorded by as_of")
    public Object spells(@PathParam("id") String id, @QueryParam("as_of") String asOf) {
        SpreadKey key = key(id);
        Instant at = QueryParams.asOf(asOf);
        if (at != null) {
            AsOf a = rebuiltAsOf(key, at);
            return new ApiViews.SpellsAsOfView(at, ruleSets.hash(at), a.recomputedUnder(), a.rebuilt().quotes(), a.method(key),
                    a.rebuilt().endedSpells().stream().map(ApiViews.SpellView::of).toList());
        }
        if (pipeline.spread(key) == null) {
            throw ProblemException.notFound("no spread " + Excerpt.of(id));
        }
        return journal.spells(key).stream().map(ApiViews.SpellView::of).toList();
    }

    private ApiViews.SpreadAsOfView spreadAsOf(SpreadKey key, Instant at) {
        AsOf a = rebuiltAsOf(key, at);
        return new ApiViews.SpreadAsOfView(at, ruleSets.hash(at), a.recomputedUnder(), a.rebuilt().quotes(), a.method(key),
                ApiViews.SpreadView.of(a.rebuilt().status(), policies.policy().probability()));
    }

    /** A spread rebuilt as of a moment, and the rule set in force now that it was rebuilt under. */
    private record AsOf(String recomputedUnder, AsOfRebuild.Rebuilt rebuilt) {
        String method(SpreadKey key) {
            return "recomputed: the " + rebuilt.quotes() + " quote message(s) of " + key.curve() + " recorded at or before as_of, "
                    + "replayed in recorded order under the rule set in force now (recomputed_under)";
        }
    }

    private AsOf rebuiltAsOf(SpreadKey key, Instant at) {
        // the rules in force now are read before the replay, so the hash named is the one the replay ran under
        String now = ruleSets.current();
        AsOfRebuild.Rebuilt r = rebuild.spread(key, at, pipeline.watches());
        if (r.status() == null) {
            throw ProblemException.notFound("no value of " + key.id() + " recorded at or before " + at);
        }
        return new AsOf(now, r);
    }

    @GET
    @Path("/spreads/{id}/history")
    @Operation(summary = "The standing value of a spread on each market date in a range; with as_of, as recorded by then")
    @APIResponse(responseCode = "200", description = "the values in market-date order; with as_of, wrapped with the moment and the rule set",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {JournalReader.HistoryPoint[].class, ApiViews.HistoryAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id, a date or as_of cannot be read, limit not a whole number from 1, or after not a cursor of this list")
    public RestResponse<Object> history(@PathParam("id") String id, @QueryParam("from") String from, @QueryParam("to") String to,
                                        @QueryParam("as_of") String asOf, @QueryParam("limit") String limit,
                                        @QueryParam("after") String after, @Context UriInfo uri) {
        key(id);
        Instant at = QueryParams.asOf(asOf);
        int n = Paging.limit(limit, MAX_ROWS, MAX_ROWS);
        LocalDate first = date(from, LocalDate.of(1900, 1, 1));
        LocalDate last = Cursors.historyPoint(after);
        if (last != null && !last.isBefore(first)) {
            first = last.plusDays(1); // one value per date: the page after a date starts the next day
        }
        Paging.Page<JournalReader.HistoryPoint> page = Paging.Page.of(journal.history(id, first, date(to, LocalDate.of(9999, 12, 31)),
                at, n + 1), n, Cursors::historyPoint);
        return list(page, at, uri, ApiViews.HistoryAsOf::new);
    }

    @GET
    @Path("/transitions")
    @Operation(summary = "Transitions in market-date order; superseded=true also shows those a revision replaced; with as_of, "
            + "as recorded by then (a transition counts as superseded only once its revision was recorded)")
    @APIResponse(responseCode = "200", description = "the transitions; with as_of, wrapped with the moment and the rule set",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {JournalReader.StoredTransition[].class, ApiViews.TransitionsAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the spread id, a date or as_of cannot be read, limit not a whole number from 1, or after not a cursor of this list")
    public RestResponse<Object> transitions(@QueryParam("spread") String spread, @QueryParam("from") String from,
                                            @QueryParam("to") String to, @QueryParam("superseded") @DefaultValue("false") boolean superseded,
                                            @QueryParam("as_of") String asOf, @QueryParam("limit") String limit,
                                            @QueryParam("after") String after, @Context UriInfo uri) {
        if (spread != null) {
            key(spread);
        }
        Instant at = QueryParams.asOf(asOf);
        int n = Paging.limit(limit, MAX_ROWS, MAX_ROWS);
        List<JournalReader.StoredTransition> rows = journal.transitions(new JournalRange(spread, date(from, LocalDate.of(1900, 1, 1)),
                date(to, LocalDate.of(9999, 12, 31)), at), superseded, Cursors.transition(after), n + 1);
        return list(Paging.Page.of(rows, n, Cursors::transition), at, uri, ApiViews.TransitionsAsOf::new);
    }

    @GET
    @Path("/rejects")
    @Operation(summary = "The most recent rejected quotes, newest first; with as_of, those recorded by then")
    @APIResponse(responseCode = "200", description = "the rejects; with as_of, wrapped with the moment and the rule set",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {JournalReader.StoredReject[].class, ApiViews.RejectsAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: as_of is not an instant, limit not a whole number from 1, "
            + "or after not a cursor of this list")
    public RestResponse<Object> rejects(@QueryParam("limit") String limit, @QueryParam("as_of") String asOf,
                                        @QueryParam("after") String after, @Context UriInfo uri) {
        Instant at = QueryParams.asOf(asOf);
        int n = Paging.limit(limit, REJECTS_BY_DEFAULT, MAX_ROWS);
        List<JournalReader.StoredReject> rows = journal.rejects(n + 1, at, Cursors.rowId(after));
        return list(Paging.Page.of(rows, n, r -> Cursors.rowId(r.id())), at, uri, ApiViews.RejectsAsOf::new);
    }

    /** The record a page read as of a moment is wrapped in: one per row type, so that the OpenAPI document can name it. */
    private interface AsOfPage<T> {
        Object wrap(Instant asOf, String policyHash, List<T> items, boolean truncated, String next);
    }

    /** A page of a history list: the plain list, or with as_of wrapped with that moment and its rule set. */
    private <T> RestResponse<Object> list(Paging.Page<T> page, Instant at, UriInfo uri, AsOfPage<T> asOf) {
        String next = Paging.next(uri, page);
        return Paging.answer(at == null ? page.items() : asOf.wrap(at, ruleSets.hash(at), page.items(), page.truncated(), next), next);
    }

    private static SpreadKey key(String id) {
        try {
            return SpreadKey.parse(id);
        } catch (IllegalArgumentException e) {
            throw QueryParams.bad(e.getMessage());
        }
    }

    private static LocalDate date(String text, LocalDate otherwise) {
        if (text == null || text.isBlank()) {
            return otherwise;
        }
        try {
            return LocalDate.parse(text);
        } catch (DateTimeParseException e) {
            throw QueryParams.bad("unparsable date " + Excerpt.quoted(text) + " (expected YYYY-MM-DD)");
        }
    }
}
