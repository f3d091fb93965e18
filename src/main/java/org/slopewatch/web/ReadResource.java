package org.slopewatch.web;

import jakarta.ws.rs.DefaultValue;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.ingest.AsOfRebuild;
import org.slopewatch.ingest.QuotePipeline;
import org.slopewatch.journal.JournalRange;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.rules.ProbabilityModels;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.text.Excerpt;

/**
 * The read API: curves, spreads, their history, transitions and rejects. The history endpoints
 * take {@code asOf} (an instant) and then answer with what the journal held at that moment,
 * wrapped with that moment and the rule set in force then; without it they answer as before.
 */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class ReadResource {

    private static final int MAX_ROWS = 10_000;

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
    @APIResponse(responseCode = "200", description = "the spread's status; with asOf, wrapped with the moment and the rule sets",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {ApiViews.SpreadView.class, ApiViews.SpreadAsOfView.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id is not CURVE:SPREAD, or asOf is not an instant")
    @APIResponse(responseCode = "404", description = "not-found: no such spread, or no value of it recorded by asOf")
    public Object spread(@PathParam("id") String id, @QueryParam("asOf") String asOf) {
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

    private ApiViews.SpreadAsOfView spreadAsOf(SpreadKey key, Instant at) {
        // the rules in force now are read before the replay, so the hash named is the one the replay ran under
        String now = ruleSets.current();
        AsOfRebuild.Rebuilt r = rebuild.spread(key, at, pipeline.watches());
        if (r.status() == null) {
            throw ProblemException.notFound("no value of " + key.id() + " recorded at or before " + at);
        }
        return new ApiViews.SpreadAsOfView(at, ruleSets.hash(at), now, r.quotes(),
                "recomputed: the " + r.quotes() + " quote message(s) of " + key.curve() + " recorded at or before as_of, replayed in "
                        + "recorded order under the rule set in force now (recomputed_under)",
                ApiViews.SpreadView.of(r.status(), policies.policy().probability()));
    }

    @GET
    @Path("/spreads/{id}/history")
    @Operation(summary = "The standing value of a spread on each market date in a range; with asOf, as recorded by then")
    @APIResponse(responseCode = "200", description = "the values in market-date order; with asOf, wrapped with the moment and the rule set",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {JournalReader.HistoryPoint[].class, ApiViews.HistoryAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id, a date or asOf cannot be read")
    public Object history(@PathParam("id") String id, @QueryParam("from") String from, @QueryParam("to") String to,
                          @QueryParam("asOf") String asOf) {
        key(id);
        Instant at = QueryParams.asOf(asOf);
        List<JournalReader.HistoryPoint> points = journal.history(id, date(from, LocalDate.of(1900, 1, 1)),
                date(to, LocalDate.of(9999, 12, 31)), at);
        return at == null ? points : new ApiViews.HistoryAsOf(at, ruleSets.hash(at), points);
    }

    @GET
    @Path("/transitions")
    @Operation(summary = "Transitions in market-date order; superseded=true also shows those a revision replaced; with asOf, "
            + "as recorded by then (a transition counts as superseded only once its revision was recorded)")
    @APIResponse(responseCode = "200", description = "the transitions; with asOf, wrapped with the moment and the rule set",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {JournalReader.StoredTransition[].class, ApiViews.TransitionsAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: the spread id, a date or asOf cannot be read")
    public Object transitions(@QueryParam("spread") String spread, @QueryParam("from") String from, @QueryParam("to") String to,
                              @QueryParam("superseded") @DefaultValue("false") boolean superseded, @QueryParam("asOf") String asOf) {
        if (spread != null) {
            key(spread);
        }
        Instant at = QueryParams.asOf(asOf);
        List<JournalReader.StoredTransition> rows = journal.transitions(new JournalRange(spread, date(from, LocalDate.of(1900, 1, 1)),
                date(to, LocalDate.of(9999, 12, 31)), at), superseded, MAX_ROWS);
        return at == null ? rows : new ApiViews.TransitionsAsOf(at, ruleSets.hash(at), rows);
    }

    @GET
    @Path("/rejects")
    @Operation(summary = "The most recent rejected quotes, newest first; with asOf, those recorded by then")
    @APIResponse(responseCode = "200", description = "the rejects; with asOf, wrapped with the moment and the rule set",
            content = @Content(mediaType = MediaType.APPLICATION_JSON,
                    schema = @Schema(oneOf = {JournalReader.StoredReject[].class, ApiViews.RejectsAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: asOf is not an instant")
    @APIResponse(responseCode = "404", description = "not-found: limit is not a number (a query parameter the REST layer cannot convert)")
    public Object rejects(@QueryParam("limit") @DefaultValue("100") int limit, @QueryParam("asOf") String asOf) {
        Instant at = QueryParams.asOf(asOf);
        List<JournalReader.StoredReject> rows = journal.rejects(Math.max(1, Math.min(limit, MAX_ROWS)), at);
        return at == null ? rows : new ApiViews.RejectsAsOf(at, ruleSets.hash(at), rows);
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
