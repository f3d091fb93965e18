package org.slopewatch.web;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.databind.ObjectMapper;
import jakarta.ws.rs.DefaultValue;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import jakarta.ws.rs.core.StreamingOutput;
import java.io.IOException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalRange;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.RowSink;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.text.Excerpt;

/**
 * Exports of observations, transitions and alerts as CSV or JSON, for spreadsheets and
 * post-mortems. Rows stream from a journal cursor straight into the response, so an export of
 * millions of rows needs no more memory than one of ten.
 */
@Path("/api")
public class ExportResource {

    static final String CSV = "text/csv; charset=utf-8; header=present";

    private final JournalReader journal;
    private final AlertHistory alerts;
    private final RuleSetAt ruleSets;
    private final JsonFactory json;

    ExportResource(JournalReader journal, AlertHistory alerts, RuleSetAt ruleSets, ObjectMapper mapper) {
        this.journal = journal;
        this.alerts = alerts;
        this.ruleSets = ruleSets;
        this.json = mapper.getFactory();
    }

    /** What one export request asks for, checked before the first byte is sent. */
    private record Request(JournalRange range, boolean csv, String policyHash) {
    }

    /** Where an export's rows come from. */
    @FunctionalInterface
    private interface Source<T> {
        void each(RowSink<T> sink) throws IOException;
    }

    @GET
    @Path("/export/observations")
    @Produces({CSV, MediaType.APPLICATION_JSON})
    @Operation(summary = "Every journalled spread value (standing=false once replaced), as CSV or JSON; with as_of, as recorded by then")
    @APIResponse(responseCode = "200", description = "the rows, as an attachment")
    @APIResponse(responseCode = "400", description = "invalid-parameter: the spread id, a date, asOf or format cannot be read")
    public Response observations(@QueryParam("spread") String spread, @QueryParam("from") String from, @QueryParam("to") String to,
                                 @QueryParam("as_of") String asOf, @QueryParam("format") @DefaultValue("csv") String format) {
        Request r = request(spread, from, to, asOf, format);
        return export(ExportTable.OBSERVATIONS, r, sink -> journal.eachObservation(r.range(), sink));
    }

    @GET
    @Path("/export/transitions")
    @Produces({CSV, MediaType.APPLICATION_JSON})
    @Operation(summary = "Every transition, superseded ones marked, as CSV or JSON; with as_of, as recorded by then")
    @APIResponse(responseCode = "200", description = "the rows, as an attachment")
    @APIResponse(responseCode = "400", description = "invalid-parameter: the spread id, a date, asOf or format cannot be read")
    public Response transitions(@QueryParam("spread") String spread, @QueryParam("from") String from, @QueryParam("to") String to,
                                @QueryParam("as_of") String asOf, @QueryParam("format") @DefaultValue("csv") String format) {
        Request r = request(spread, from, to, asOf, format);
        return export(ExportTable.TRANSITIONS, r, sink -> journal.eachTransition(r.range(), sink));
    }

    @GET
    @Path("/export/alerts")
    @Produces({CSV, MediaType.APPLICATION_JSON})
    @Operation(summary = "Every notice (spread: its subject; from/to: its market date), as CSV or JSON; with as_of, as recorded by then")
    @APIResponse(responseCode = "200", description = "the rows, as an attachment")
    @APIResponse(responseCode = "400", description = "invalid-parameter: the spread id, a date, asOf or format cannot be read")
    public Response alerts(@QueryParam("spread") String spread, @QueryParam("from") String from, @QueryParam("to") String to,
                           @QueryParam("as_of") String asOf, @QueryParam("format") @DefaultValue("csv") String format) {
        Request r = request(spread, from, to, asOf, format);
        return export(ExportTable.ALERTS, r, sink -> alerts.eachAlert(r.range(), sink));
    }

    private Request request(String spread, String from, String to, String asOf, String format) {
        SpreadKey key = QueryParams.spread(spread);
        Instant at = QueryParams.asOf(asOf);
        LocalDate fromDate = QueryParams.date(from, QueryParams.EARLIEST);
        LocalDate toDate = QueryParams.date(to, QueryParams.LATEST);
        if (!"csv".equals(format) && !"json".equals(format)) {
            throw QueryParams.bad("format must be csv or json, not " + Excerpt.quoted(format));
        }
        return new Request(new JournalRange(key == null ? null : key.id(), fromDate, toDate, at), "csv".equals(format), ruleSets.hash(at));
    }

    private <T> Response export(ExportTable<T> table, Request r, Source<T> source) {
        JournalRange range = r.range();
        StreamingOutput body = out -> {
            TableWriter writer = r.csv() ? new CsvTableWriter(out, table.names()) : new JsonTableWriter(out, json, head(table, r), table.names());
            source.each(row -> writer.row(table.values(row)));
            writer.finish();
        };
        return Response.ok(body, r.csv() ? CSV : MediaType.APPLICATION_JSON)
                .header("Content-Disposition", "attachment; filename=\"" + filename(table, range, r.csv()) + "\"")
                // a CSV file has no place for these, so they travel in headers too
                .header("X-Slopewatch-As-Of", range.asOf() == null ? "now" : range.asOf().toString())
                .header("X-Slopewatch-Policy-Hash", r.policyHash() == null ? "none" : r.policyHash())
                .build();
    }

    private static Map<String, Object> head(ExportTable<?> table, Request r) {
        Map<String, Object> head = new LinkedHashMap<>();
        head.put("export", table.name());
        head.put("spread", r.range().spreadId());
        head.put("from", r.range().from());
        head.put("to", r.range().to());
        head.put("as_of", r.range().asOf());
        head.put("policy_hash", r.policyHash());
        return head;
    }

    /** e.g. slopewatch-transitions-GOVT-A_10Y-3M-asof-2026-04-01T173000Z.csv: safe in every file system and header. */
    static String filename(ExportTable<?> table, JournalRange range, boolean csv) {
        StringBuilder name = new StringBuilder("slopewatch-").append(table.name());
        if (range.spreadId() != null) {
            name.append('-').append(range.spreadId());
        }
        if (range.asOf() != null) {
            name.append("-asof-").append(range.asOf().toString().replace(":", ""));
        }
        return name.toString().replaceAll("[^A-Za-z0-9._-]", "_") + (csv ? ".csv" : ".json");
    }
}
