package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.ingest.HistoryCsvReader;
import org.slopewatch.ingest.HistoryFormatException;
import org.slopewatch.ingest.IngestConfig;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.ingest.QuoteBatch;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.ingest.QuoteGateway;
import org.slopewatch.ingest.QuoteMessage;
import org.slopewatch.ingest.Reject;
import org.slopewatch.ingest.RejectReason;

/**
 * {@code POST /api/quotes}: quotes as JSON (a quote, a snapshot or an array of either) or CSV in
 * the replay's layouts. Answers with counts and the first errors; 400 when nothing was accepted.
 */
@Path("/api/quotes")
public class QuoteResource {

    private static final long TIMEOUT_SECONDS = 30;

    private final QuoteDecoder decoder;
    private final IngestRules rules;
    private final QuoteGateway gateway;
    private final int maxBatch;

    QuoteResource(QuoteDecoder decoder, IngestRules rules, QuoteGateway gateway, IngestConfig config) {
        this.decoder = decoder;
        this.rules = rules;
        this.gateway = gateway;
        this.maxBatch = config.maxBatch();
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Produces(MediaType.APPLICATION_JSON)
    @Operation(summary = "Submit quotes as JSON: a quote, a snapshot, or an array of either")
    public Response postJson(String body) {
        return submit(decoder.decode("http", body));
    }

    @POST
    @Consumes({"text/csv", MediaType.TEXT_PLAIN})
    @Produces(MediaType.APPLICATION_JSON)
    @Operation(summary = "Submit quotes as CSV: wide 'date,3M,2Y,10Y,…' (name the curve with ?curve=) or long 'date,curve,tenor,yield'")
    public Response postCsv(String body, @QueryParam("curve") String curve, @QueryParam("unit") String unit) {
        List<QuoteMessage> messages = new ArrayList<>();
        List<Reject> rejects = new ArrayList<>();
        try {
            YieldUnit yieldUnit = unit == null ? YieldUnit.PERCENT : YieldUnit.parse(unit);
            HistoryCsvReader.read("request", new ByteArrayInputStream(body.getBytes(StandardCharsets.UTF_8)),
                    new HistoryCsvReader.Options(curve == null ? "?" : curve, yieldUnit, rules.bounds()),
                    snapshot -> {
                        QuoteMessage m = QuoteMessage.of(snapshot.curve(), snapshot.date(), snapshot.asMap());
                        Reject problem = decoder.check(m, messages.size() + rejects.size());
                        if (problem == null) {
                            messages.add(m);
                        } else {
                            rejects.add(problem);
                        }
                    }, () -> { });
        } catch (HistoryFormatException e) {
            return Response.status(Response.Status.BAD_REQUEST).entity(new IngestAnswer(false, 0, 0, 1, 0,
                    List.of(new IngestAnswer.Error(null, RejectReason.MALFORMED.code(), e.getMessage())))).build();
        } catch (IllegalArgumentException e) {
            return Response.status(Response.Status.BAD_REQUEST).entity(new IngestAnswer(false, 0, 0, 1, 0,
                    List.of(new IngestAnswer.Error(null, RejectReason.UNKNOWN_UNIT.code(), e.getMessage())))).build();
        } catch (IOException e) {
            throw new IllegalStateException("cannot read the request body", e);
        }
        return submit(new QuoteBatch("csv", messages, rejects));
    }

    private Response submit(QuoteBatch batch) {
        int items = batch.messages().size() + batch.rejects().size();
        if (items > maxBatch) {
            // nothing is taken: a client that sends too much at once should split, not lose the tail
            return Response.status(413).entity(new IngestAnswer(false, 0, 0, 0, 0, List.of(new IngestAnswer.Error(null, "too-large",
                    "the request carries " + items + " quote messages; at most " + maxBatch + " per request "
                            + "(slopewatch.ingest.max-batch): split it")))).build();
        }
        QuoteGateway.Submitted submitted;
        try {
            submitted = gateway.submit(batch).toCompletableFuture().get(TIMEOUT_SECONDS, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return Response.status(Response.Status.SERVICE_UNAVAILABLE).build();
        } catch (ExecutionException | TimeoutException e) {
            Throwable cause = e instanceof ExecutionException ? e.getCause() : e;
            return Response.status(Response.Status.SERVICE_UNAVAILABLE)
                    .entity(new IngestAnswer(false, 0, 0, 0, 0, List.of(new IngestAnswer.Error(null, "unavailable",
                            "the quotes could not be processed: " + cause.getMessage())))).build();
        }
        IngestAnswer answer = IngestAnswer.of(submitted.processed(), submitted.outcome());
        boolean nothingTaken = answer.accepted() == 0 && answer.duplicates() == 0;
        Response.Status status = nothingTaken ? Response.Status.BAD_REQUEST
                : submitted.processed() ? Response.Status.OK : Response.Status.ACCEPTED;
        return Response.status(status).entity(answer).build();
    }
}
