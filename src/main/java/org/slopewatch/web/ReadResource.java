package org.slopewatch.web;

import jakarta.ws.rs.DefaultValue;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.NotFoundException;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.BadRequestException;
import jakarta.ws.rs.core.MediaType;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.ingest.QuotePipeline;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.rules.ProbabilityModels;
import org.slopewatch.spread.SpreadKey;

/** The read API: curves, spreads, their history, transitions and rejects. */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class ReadResource {

    private static final int MAX_ROWS = 10_000;

    private final QuotePipeline pipeline;
    private final JournalReader journal;
    private final PolicyHolder policies;

    ReadResource(QuotePipeline pipeline, JournalReader journal, PolicyHolder policies) {
        this.pipeline = pipeline;
        this.journal = journal;
        this.policies = policies;
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
    public ApiViews.CurveView curve(@PathParam("curve") String curve, @PathParam("date") String date) {
        var snapshot = pipeline.curve(curve, date(date, null));
        if (snapshot == null) {
            throw new NotFoundException("no quotes for " + curve + " on " + date);
        }
        return ApiViews.CurveView.of(snapshot);
    }

    @GET
    @Path("/curves/{curve}")
    @Operation(summary = "A curve's snapshot on the latest market date on or before a date (e.g. three months back, for comparison)")
    public ApiViews.CurveView curveOnOrBefore(@PathParam("curve") String curve, @QueryParam("on_or_before") String onOrBefore) {
        if (onOrBefore == null) {
            throw new BadRequestException("give on_or_before=YYYY-MM-DD");
        }
        var snapshot = pipeline.curveOnOrBefore(curve, date(onOrBefore, null));
        if (snapshot == null) {
            throw new NotFoundException("no quotes for " + curve + " on or before " + onOrBefore);
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
    @Operation(summary = "One spread's status; the id is CURVE:SPREAD, e.g. GOVT-A:10Y-3M")
    public ApiViews.SpreadView spread(@PathParam("id") String id) {
        SpreadStatus s = pipeline.spread(key(id));
        if (s == null) {
            throw new NotFoundException("no spread " + id);
        }
        return ApiViews.SpreadView.of(s, policies.policy().probability());
    }

    @GET
    @Path("/spreads/{id}/history")
    @Operation(summary = "The standing value of a spread on each market date in a range")
    public List<JournalReader.HistoryPoint> history(@PathParam("id") String id, @QueryParam("from") String from,
                                                    @QueryParam("to") String to) {
        key(id);
        return journal.history(id, date(from, LocalDate.of(1900, 1, 1)), date(to, LocalDate.of(9999, 12, 31)));
    }

    @GET
    @Path("/transitions")
    @Operation(summary = "Transitions in market-date order; superseded=true also shows those a revision replaced")
    public List<JournalReader.StoredTransition> transitions(@QueryParam("spread") String spread, @QueryParam("from") String from,
                                                            @QueryParam("to") String to,
                                                            @QueryParam("superseded") @DefaultValue("false") boolean superseded) {
        if (spread != null) {
            key(spread);
        }
        return journal.transitions(spread, date(from, LocalDate.of(1900, 1, 1)), date(to, LocalDate.of(9999, 12, 31)), superseded,
                MAX_ROWS);
    }

    @GET
    @Path("/rejects")
    @Operation(summary = "The most recent rejected quotes, newest first")
    public List<JournalReader.StoredReject> rejects(@QueryParam("limit") @DefaultValue("100") int limit) {
        return journal.rejects(Math.max(1, Math.min(limit, MAX_ROWS)));
    }

    private static SpreadKey key(String id) {
        try {
            return SpreadKey.parse(id);
        } catch (IllegalArgumentException e) {
            throw new BadRequestException(e.getMessage());
        }
    }

    private static LocalDate date(String text, LocalDate otherwise) {
        if (text == null || text.isBlank()) {
            return otherwise;
        }
        try {
            return LocalDate.parse(text);
        } catch (DateTimeParseException e) {
            throw new BadRequestException("unparsable date '" + text + "' (expected YYYY-MM-DD)");
        }
    }
}
