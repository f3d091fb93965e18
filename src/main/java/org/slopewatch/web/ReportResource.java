package org.slopewatch.web;

import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.Watch;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.replay.SpreadReport;
import org.slopewatch.report.ChartPoint;
import org.slopewatch.report.JournalDocument;
import org.slopewatch.report.PolicySummary;
import org.slopewatch.report.ReportHtml;
import org.slopewatch.report.SpreadProbability;
import org.slopewatch.rules.Policy;
import org.slopewatch.spread.SpreadKey;

/** {@code GET /api/report}: the journal's story of one or more spreads as a self-contained HTML page. */
@Path("/api/report")
public class ReportResource {

    private static final int MAX_TRANSITIONS = 10_000;
    private static final LocalDate EARLIEST = LocalDate.of(1900, 1, 1);
    private static final LocalDate LATEST = LocalDate.of(9999, 12, 31);

    private final JournalReader journal;
    private final PolicyHolder policies;
    private final QuotePipeline pipeline;
    private final Clock clock;

    ReportResource(JournalReader journal, PolicyHolder policies, QuotePipeline pipeline, Clock clock) {
        this.journal = journal;
        this.policies = policies;
        this.pipeline = pipeline;
        this.clock = clock;
    }

    @GET
    @Produces(MediaType.TEXT_HTML)
    @Operation(summary = "An HTML report of spreads from the journal (repeat spread=CURVE:SPREAD): findings (state now, "
            + "recession probability), chart, spells, transitions, and the policy in force with its SHA-256")
    @APIResponse(responseCode = "200", description = "the report, one self-contained HTML page")
    @APIResponse(responseCode = "400", description = "invalid-parameter: no spread named, or one that is not CURVE:SPREAD")
    @APIResponse(responseCode = "404", description = "not-found: no journalled values for a spread named")
    public String report(@QueryParam("spread") List<String> ids) {
        if (ids == null || ids.isEmpty()) {
            throw QueryParams.bad("name at least one spread: ?spread=CURVE:SPREAD, e.g. GOVT-A:10Y-3M");
        }
        PolicyHolder.Loaded loaded = policies.current();
        List<JournalDocument.SpreadInput> spreads = new ArrayList<>();
        for (String id : ids) {
            SpreadKey key = key(id);
            List<ChartPoint> values = journal.history(key.id(), EARLIEST, LATEST).stream()
                    .map(p -> new ChartPoint(p.date(), p.valueBp())).toList();
            if (values.isEmpty()) {
                throw ProblemException.notFound("no journalled values for " + key.id());
            }
            List<SpreadReport.TransitionRow> transitions = journal.transitions(key.id(), EARLIEST, LATEST, false, MAX_TRANSITIONS)
                    .stream().map(t -> new SpreadReport.TransitionRow(t.date(), t.from(), t.to(), t.test(), t.window(), t.measured(),
                            t.valueBp(), t.spellId(), t.reason())).toList();
            // the probability as /api/spreads gives it: the policy in force on the spread's month averages now
            SpreadStatus status = pipeline.spread(key);
            SpreadProbability probability = status == null ? null : SpreadProbability.of(loaded.policy().probability(), status);
            spreads.add(new JournalDocument.SpreadInput(key, rules(loaded.policy(), key), values, transitions, probability));
        }
        PolicySummary policy = new PolicySummary(loaded.source(), loaded.hash(),
                "the policy in force when this report was made; each transition was decided under the policy in force at its time",
                PolicySummary.rules(loaded.policy().watches()));
        return ReportHtml.render(JournalDocument.of(spreads, policy, "the daemon's journal", clock.instant()));
    }

    private static String rules(Policy policy, SpreadKey key) {
        for (Watch w : policy.watches()) {
            if (w.spread().name().equals(key.spread()) && w.appliesTo(key.curve())) {
                return w.rules().describe();
            }
        }
        return "not watched by the policy in force";
    }

    private static SpreadKey key(String id) {
        try {
            return SpreadKey.parse(id);
        } catch (IllegalArgumentException e) {
            throw QueryParams.bad(e.getMessage());
        }
    }
}
