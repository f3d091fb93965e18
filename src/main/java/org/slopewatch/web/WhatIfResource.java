package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.net.URI;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.replay.CandidatePolicy;
import org.slopewatch.replay.SpreadFilter;
import org.slopewatch.replay.WhatIfReport;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.text.Excerpt;
import org.slopewatch.whatif.WhatIfJob;
import org.slopewatch.whatif.WhatIfJobs;

/**
 * {@code POST /api/what-if}: another policy's alert rules on the stored history (or on a history
 * sent along), as a background job on this instance; {@code GET /api/what-if/{id}}: its state,
 * progress and result, as the journal holds them, whichever instance runs it ({@link WhatIfJobs}).
 * A what-if builds engines of its own and only reads the journal: live state is never touched.
 */
@Path("/api/what-if")
@Produces(MediaType.APPLICATION_JSON)
public class WhatIfResource {

    /** The name the policy text goes by in problems ({@code policy:12:5: …}) and in the report. */
    static final String POLICY_SOURCE = "policy";
    static final String HISTORY_SOURCE = "history";

    private final WhatIfJobs jobs;
    private final IngestRules rules;

    WhatIfResource(WhatIfJobs jobs, IngestRules rules) {
        this.jobs = jobs;
        this.rules = rules;
    }

    /**
     * @param policy  the policy file's text (YAML), required
     * @param spreads spread ids or names to look at; none: every spread the policy watches
     * @param history a history CSV in the replay's layouts to run instead of the journal (then nothing live is compared)
     * @param curve   the curve of a wide history ({@code date,3M,10Y,…})
     * @param unit    the history's yield unit: percent (default), bp or decimal
     */
    public record WhatIfRequest(String policy, List<String> spreads, String history, String curve, String unit) {
    }

    public record Started(String id, String state, String location) {
    }

    public record Progress(long done, long total) {
    }

    public record JobView(String id, String state, Progress progress, String history, Instant submittedAt, Instant startedAt,
                          Instant finishedAt, WhatIfReport result, String error) {

        static JobView of(WhatIfJob j) {
            return new JobView(j.id(), j.state().label(), new Progress(j.done(), j.total()), j.history(), j.submittedAt(),
                    j.startedAt(), j.finishedAt(), j.result(), j.error());
        }
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Start a what-if: what another policy's alert rules would have fired on the stored history (or on "
            + "'history', a CSV), compared with what fired; answers 202 with the job's id")
    @APIResponse(responseCode = "202", description = "started; the job's state is at location",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = Started.class)))
    @APIResponse(responseCode = "400", description = "invalid-policy (problems, line, column), invalid-history (line, column) or "
            + "invalid-body: no policy, an unknown spread or unit, or not JSON")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: the body is not application/json")
    @APIResponse(responseCode = "429", description = "busy: what-ifs are queued to the limit")
    public Response start(WhatIfRequest request) {
        if (request == null || request.policy() == null || request.policy().isBlank()) {
            throw ProblemException.invalidBody("give the policy to try: {\"policy\": \"<the policy file's YAML>\", "
                    + "\"spreads\": [\"GOVT-A:10Y-3M\"]}");
        }
        CandidatePolicy policy;
        SpreadFilter filter;
        try {
            policy = CandidatePolicy.parse(POLICY_SOURCE, request.policy().getBytes(StandardCharsets.UTF_8));
            filter = SpreadFilter.of(request.spreads());
        } catch (PolicyException e) {
            throw policyProblems(e);
        } catch (IllegalArgumentException e) {
            throw ProblemException.invalidBody(e.getMessage());
        }
        Optional<WhatIfJob> job;
        if (request.history() == null) {
            job = jobs.onJournal(policy, filter);
        } else {
            List<CurveSnapshot> snapshots = new ArrayList<>();
            try {
                YieldUnit unit = request.unit() == null ? YieldUnit.PERCENT : YieldUnit.parse(request.unit());
                HistoryCsvReader.read(HISTORY_SOURCE, new ByteArrayInputStream(request.history().getBytes(StandardCharsets.UTF_8)),
                        new HistoryCsvReader.Options(request.curve() == null ? "?" : request.curve(), unit, rules.bounds()),
                        snapshots::add, () -> { });
            } catch (HistoryFormatException e) {
                throw new ProblemException(ProblemType.INVALID_HISTORY, e.getMessage(), place(e.line(), e.column()));
            } catch (IllegalArgumentException e) {
                throw ProblemException.invalidBody(e.getMessage());
            } catch (IOException e) {
                throw new IllegalStateException("cannot read the request body", e);
            }
            job = jobs.onHistory(policy, filter, HISTORY_SOURCE, snapshots);
        }
        if (job.isEmpty()) {
            throw new ProblemException(ProblemType.BUSY, "what-ifs are queued to the limit; try again when one has finished");
        }
        String location = "/api/what-if/" + job.get().id();
        return Response.accepted(new Started(job.get().id(), job.get().state().label(), location)).location(URI.create(location)).build();
    }

    @GET
    @Path("/{id}")
    @Operation(summary = "A what-if's state (running, done, failed, or abandoned when the instance running it stopped), progress in "
            + "quote messages, and its report when done; answered by any instance on the journal")
    @APIResponse(responseCode = "200", description = "the job")
    @APIResponse(responseCode = "404", description = "not-found: no what-if with this id (finished ones are kept for a while)")
    public JobView job(@PathParam("id") String id) {
        return jobs.find(id).map(JobView::of)
                .orElseThrow(() -> ProblemException.notFound("no what-if " + Excerpt.of(id) + " (finished ones are kept for a while)"));
    }

    /** The policy's problems, each as file:line:column: message, and the place of the first as line and column. */
    private static ProblemException policyProblems(PolicyException e) {
        Map<String, Object> members = new LinkedHashMap<>();
        members.put("problems", e.lines());
        if (!e.problems().isEmpty()) {
            members.putAll(place(e.problems().get(0).line(), e.problems().get(0).column()));
        }
        return new ProblemException(ProblemType.INVALID_POLICY, "the policy has problems; nothing was run", members);
    }

    private static Map<String, Object> place(long line, int column) {
        Map<String, Object> place = new LinkedHashMap<>();
        place.put("line", line);
        place.put("column", column);
        return place;
    }
}
