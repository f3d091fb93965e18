package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.Context;
import jakarta.ws.rs.core.HttpHeaders;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.slopewatch.ingest.CsvQuoteDecoder;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.ingest.QuoteGateway;
import org.slopewatch.pipeline.IngestConfig;
import org.slopewatch.pipeline.QuoteBatch;

/**
 * {@code POST /api/quotes}: quotes as JSON (a quote, a snapshot or an array of either) or CSV in
 * the replay's layouts. Both are decoded into a {@link QuoteBatch} and submitted alike, rejects
 * included, so that the pipeline journals and counts every reject whatever the format. Answers
 * with counts and the first errors; 400 when nothing was accepted.
 */
@Path("/api/quotes")
public class QuoteResource {

    private static final long TIMEOUT_SECONDS = 30;

    private final QuoteDecoder decoder;
    private final CsvQuoteDecoder csv;
    private final QuoteGateway gateway;
    private final int maxBatch;

    QuoteResource(QuoteDecoder decoder, CsvQuoteDecoder csv, QuoteGateway gateway, IngestConfig config) {
        this.decoder = decoder;
        this.csv = csv;
        this.gateway = gateway;
        this.maxBatch = config.maxBatch();
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Produces(MediaType.APPLICATION_JSON)
    @Operation(summary = "Submit quotes as JSON: a quote, a snapshot, or an array of either")
    @APIResponse(responseCode = "200", description = "processed: counts and the first rejects",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = IngestAnswer.class)))
    @APIResponse(responseCode = "202", description = "queued on the topic (Kafka): counts of what the edge checked",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = IngestAnswer.class)))
    @APIResponse(responseCode = "400", description = "quotes-rejected: nothing was taken; the extension members are the counts and "
            + "errors of the answer")
    @APIResponse(responseCode = "413", description = "too-large: a body over quarkus.http.limits.max-body-size or a batch over "
            + "slopewatch.ingest.max-batch; nothing was taken")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: neither JSON nor CSV")
    @APIResponse(responseCode = "503", description = "unavailable: the pipeline did not answer in time")
    public Response postJson(String body) {
        return submit(decoder.decode("http", body));
    }

    @POST
    @Consumes({"text/csv", MediaType.TEXT_PLAIN})
    @Produces(MediaType.APPLICATION_JSON)
    @Operation(summary = "Submit quotes as CSV: wide 'date,3M,2Y,10Y,…' (name the curve with ?curve=) or long 'date,curve,tenor,yield'; "
            + "UTF-8 unless the content type names a charset; a file that cannot be read is refused whole, naming line:column")
    @APIResponse(responseCode = "200", description = "processed: counts and the first rejects",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = IngestAnswer.class)))
    @APIResponse(responseCode = "202", description = "queued on the topic (Kafka): counts of what the edge checked",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = IngestAnswer.class)))
    @APIResponse(responseCode = "400", description = "quotes-rejected: nothing was taken; the extension members are the counts and "
            + "errors of the answer")
    @APIResponse(responseCode = "413", description = "too-large: a body over quarkus.http.limits.max-body-size or a batch over "
            + "slopewatch.ingest.max-batch; nothing was taken")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: neither JSON nor CSV")
    @APIResponse(responseCode = "503", description = "unavailable: the pipeline did not answer in time")
    public Response postCsv(byte[] body, @QueryParam("curve") String curve, @QueryParam("unit") String unit, @Context HttpHeaders headers) {
        MediaType type = headers.getMediaType();
        String charset = type == null ? null : type.getParameters().get(MediaType.CHARSET_PARAMETER);
        return submit(csv.decode("csv", body, charset, curve, unit));
    }

    private Response submit(QuoteBatch batch) {
        int items = batch.messages().size() + batch.rejects().size();
        if (items > maxBatch) {
            // nothing is taken: a client that sends too much at once should split, not lose the tail
            String why = "the request carries " + items + " quote messages; at most " + maxBatch + " per request "
                    + "(slopewatch.ingest.max-batch): split it";
            throw new ProblemException(ProblemType.TOO_LARGE, why + "; nothing was taken",
                    IngestAnswer.refused("too-large", why).members());
        }
        QuoteGateway.Submitted submitted;
        try {
            submitted = gateway.submit(batch).toCompletableFuture().get(TIMEOUT_SECONDS, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new ProblemException(ProblemType.UNAVAILABLE, "interrupted before the pipeline answered: the quotes may or may not "
                    + "have been taken", IngestAnswer.refused("unavailable", "interrupted before the pipeline answered").members());
        } catch (ExecutionException | TimeoutException e) {
            Throwable cause = e instanceof ExecutionException ? e.getCause() : e;
            String why = "the quotes could not be processed: " + cause.getMessage();
            throw new ProblemException(ProblemType.UNAVAILABLE, why, IngestAnswer.refused("unavailable", why).members());
        }
        IngestAnswer answer = IngestAnswer.of(submitted.processed(), submitted.outcome());
        if (answer.accepted() == 0 && answer.duplicates() == 0) {
            throw new ProblemException(ProblemType.QUOTES_REJECTED, "nothing was taken: " + answer.rejected() + " quote message(s) "
                    + "rejected, the first " + answer.errors().size() + " in errors", answer.members());
        }
        return Response.status(submitted.processed() ? Response.Status.OK : Response.Status.ACCEPTED).entity(answer).build();
    }
}
