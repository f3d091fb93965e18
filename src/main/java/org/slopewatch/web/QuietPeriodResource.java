package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.DELETE;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import java.time.Clock;
import java.time.DateTimeException;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.journal.QuietPeriodBook;

/**
 * Quiet periods: a rule or a spread whose notices are journalled but not sent until a time, set
 * with a note and who set it, and lifted early with who lifted it. Every field is checked before
 * anything is kept ({@link AlertRequests}).
 */
@Path("/api/quiet-periods")
@Produces(MediaType.APPLICATION_JSON)
public class QuietPeriodResource {

    /** The longest quiet period: a desk that wants longer should change the policy instead. */
    static final Duration LONGEST = Duration.ofDays(90);

    private final AlertDesk desk;
    private final Clock clock;
    private final PolicyHolder policies;
    private final IngestRules ingest;

    QuietPeriodResource(AlertDesk desk, Clock clock, PolicyHolder policies, IngestRules ingest) {
        this.desk = desk;
        this.clock = clock;
        this.policies = policies;
        this.ingest = ingest;
    }

    /**
     * A quiet period to set: exactly one of {@code rule} and {@code spread} (an id such as
     * GOVT-A:10Y-3M, or a spread name for every curve); how long it {@code lasts} (ISO-8601, such as
     * PT4H) or {@code until} when (an instant); a {@code note} saying why and who {@code set_by} it.
     */
    public record QuietPeriodRequest(String rule, String spread, String lasts, String until, String note, String setBy) {
    }

    /** A quiet period as the API shows it: {@code rule} or {@code spread} set, the other null. */
    public record QuietPeriodView(long id, String rule, String spread, Instant until, String note, String setBy, Instant setAt,
                                  boolean active, Instant liftedAt, String liftedBy) {

        static QuietPeriodView of(QuietPeriodBook.QuietPeriod q, Instant now) {
            boolean onRule = "rule".equals(q.kind());
            return new QuietPeriodView(q.id(), onRule ? q.target() : null, onRule ? null : q.target(), q.until(), q.note(), q.setBy(),
                    q.setAt(), q.activeAt(now), q.liftedAt(), q.liftedBy());
        }
    }

    public record QuietPeriodsView(List<QuietPeriodView> quietPeriods) {
    }

    @GET
    @Operation(summary = "Quiet periods, newest first, with whether each is active")
    public QuietPeriodsView list() {
        Instant now = clock.instant();
        return new QuietPeriodsView(desk.quietPeriods().stream().map(q -> QuietPeriodView.of(q, now)).toList());
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Set a quiet period on a rule or a spread: its notices are journalled but not sent until it ends (lasts: an "
            + "ISO-8601 duration such as PT4H, or until: an instant), with a note and who set it")
    public Response set(QuietPeriodRequest r) {
        if (r == null || blank(r.setBy()) || blank(r.note())) {
            return error(Response.Status.BAD_REQUEST, "a quiet period needs set_by and note, and one of rule or spread");
        }
        if (blank(r.rule()) == blank(r.spread())) {
            return error(Response.Status.BAD_REQUEST, "name exactly one of rule or spread");
        }
        String rule = blank(r.rule()) ? null : r.rule().strip();
        String spread = blank(r.spread()) ? null : r.spread().strip();
        String note = r.note().strip();
        String setBy = r.setBy().strip();
        String problem = new AlertRequests(policies.policy(), ingest.curves()).quietPeriod(rule, spread, note, setBy);
        if (problem != null) {
            return error(Response.Status.BAD_REQUEST, problem);
        }
        Instant now = clock.instant();
        Instant until;
        try {
            until = !blank(r.until()) ? Instant.parse(r.until().strip())
                    : !blank(r.lasts()) ? now.plus(Duration.parse(r.lasts().strip())) : null;
        } catch (DateTimeException | ArithmeticException e) {
            // a duration too long for an instant overflows rather than failing to parse
            return error(Response.Status.BAD_REQUEST, "lasts must be an ISO-8601 duration (e.g. PT4H) and until an instant (e.g. "
                    + "2026-07-01T08:00:00Z), ending within " + LONGEST.toDays() + " days");
        }
        if (until == null || !until.isAfter(now) || until.isAfter(now.plus(LONGEST))) {
            return error(Response.Status.BAD_REQUEST, "a quiet period must end in the future and within " + LONGEST.toDays() + " days");
        }
        QuietPeriodBook.QuietPeriod q = rule != null ? desk.setQuietPeriod("rule", rule, until, note, setBy)
                : desk.setQuietPeriod("spread", spread, until, note, setBy);
        return Response.status(Response.Status.CREATED).entity(QuietPeriodView.of(q, now)).build();
    }

    @DELETE
    @Path("/{id}")
    @Operation(summary = "Lift a quiet period early: ?lifted_by=name")
    public Response lift(@PathParam("id") long id, @QueryParam("lifted_by") String liftedBy) {
        if (blank(liftedBy)) {
            return error(Response.Status.BAD_REQUEST, "say who lifts the quiet period: ?lifted_by=name");
        }
        String problem = AlertRequests.lift(liftedBy.strip());
        if (problem != null) {
            return error(Response.Status.BAD_REQUEST, problem);
        }
        return desk.lift(id, liftedBy.strip()) ? Response.noContent().build()
                : error(Response.Status.NOT_FOUND, "no active quiet period " + id);
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }

    static Response error(Response.Status status, String message) {
        return Response.status(status).type(MediaType.APPLICATION_JSON).entity(Map.of("error", message)).build();
    }
}
