package org.slopewatch.web;

import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.slopewatch.journal.AlertStore;
import org.slopewatch.journal.JournalRange;
import org.slopewatch.journal.JournalReader;

/** A spread's timeline: its observations, transitions, notices and what became of them, in the order the journal learned them. */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class TimelineResource {

    /** Rows read of each kind; a range with more is answered truncated, and a narrower one gives the rest. */
    static final int MAX_PER_KIND = 10_000;

    /**
     * The timeline of a spread in a market-date range as the journal held it at {@code as_of}
     * (null: now), with the rule set in force then.
     */
    public record TimelineView(String spread, LocalDate from, LocalDate to, Instant asOf, String policyHash, boolean truncated,
                               List<TimelineItem> items) {
    }

    private final JournalReader journal;
    private final AlertStore alerts;
    private final RuleSetAt ruleSets;

    TimelineResource(JournalReader journal, AlertStore alerts, RuleSetAt ruleSets) {
        this.journal = journal;
        this.alerts = alerts;
        this.ruleSets = ruleSets;
    }

    @GET
    @Path("/spreads/{id}/timeline")
    @Operation(summary = "Observations, transitions (superseded ones marked), alerts, delivery attempts and acknowledgements of a spread "
            + "in recorded order; with asOf, as the journal held them then")
    @APIResponse(responseCode = "200", description = "the timeline")
    @APIResponse(responseCode = "400", description = "invalid-parameter: the id, a date or asOf cannot be read")
    public TimelineView timeline(@PathParam("id") String id, @QueryParam("from") String from, @QueryParam("to") String to,
                                 @QueryParam("asOf") String asOf) {
        String spread = QueryParams.spread(id).id();
        LocalDate fromDate = QueryParams.date(from, null);
        LocalDate toDate = QueryParams.date(to, null);
        Instant at = QueryParams.asOf(asOf);
        JournalRange range = new JournalRange(spread, fromDate == null ? QueryParams.EARLIEST : fromDate,
                toDate == null ? QueryParams.LATEST : toDate, at);
        List<JournalReader.StoredObservation> observations = journal.observations(range, MAX_PER_KIND + 1);
        List<JournalReader.StoredTransition> transitions = journal.transitions(range, true, MAX_PER_KIND + 1);
        List<AlertStore.AlertView> notices = alerts.forSubject(range, MAX_PER_KIND + 1);
        boolean truncated = observations.size() > MAX_PER_KIND || transitions.size() > MAX_PER_KIND || notices.size() > MAX_PER_KIND;
        notices = notices.subList(0, Math.min(notices.size(), MAX_PER_KIND));
        List<AlertStore.StoredAttempt> attempts = alerts.attempts(notices.stream().map(v -> v.stored().alert().id()).toList(), at);
        List<TimelineItem> items = SpreadTimeline.merge(observations.subList(0, Math.min(observations.size(), MAX_PER_KIND)),
                transitions.subList(0, Math.min(transitions.size(), MAX_PER_KIND)), notices, attempts);
        return new TimelineView(spread, fromDate, toDate, at, ruleSets.hash(at), truncated, items);
    }
}
