package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.DELETE;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.Context;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import jakarta.ws.rs.core.UriBuilder;
import jakarta.ws.rs.core.UriInfo;
import java.net.URI;
import java.time.Clock;
import java.time.DateTimeException;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.jboss.resteasy.reactive.RestResponse;
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
    /** Quiet periods a page holds at most, and unless {@code limit} says otherwise. */
    static final int MAX_PER_PAGE = 1000;

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

    @GET
    @Operation(summary = "Quiet periods, newest first, with whether each is active")
    @APIResponse(responseCode = "200", description = "a page of quiet periods, newest first")
    @APIResponse(responseCode = "400", description = "invalid-parameter: limit not a whole number from 1, after not a cursor of this list")
    public RestResponse<List<QuietPeriodView>> list(@QueryParam("limit") String limit, @QueryParam("after") String after,
                                                    @Context UriInfo uri) {
        return page(limit, after, uri, QuietPeriodView::of);
    }

    @GET
    @Path("/{id}")
    @Operation(summary = "One quiet period, with whether it is active")
    @APIResponse(responseCode = "200", description = "the quiet period")
    @APIResponse(responseCode = "404", description = "not-found: no quiet period with this id")
    public QuietPeriodView one(@PathParam("id") long id) {
        Instant now = clock.instant();
        return kept(id).map(q -> QuietPeriodView.of(q, now)).orElseThrow(() -> ProblemException.notFound("no quiet period " + id));
    }

    @POST
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Set a quiet period on a rule or a spread: its notices are journalled but not sent until it ends (lasts: an "
            + "ISO-8601 duration such as PT4H, or until: an instant), with a note and who set it")
    @APIResponse(responseCode = "201", description = "the quiet period set; Location: where it is kept",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = QuietPeriodView.class)))
    @APIResponse(responseCode = "400", description = "invalid-body: a field missing, too long or holding a control character, a rule "
            + "or spread the policy in force does not know, an end not in the next 90 days, or not JSON")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: the body is not application/json")
    public Response set(QuietPeriodRequest r) {
        QuietPeriodBook.QuietPeriod q = keep(r);
        // answered as kept, so that it reads the same as from its Location (the journal keeps instants to the microsecond)
        return Response.created(location(q.id())).entity(QuietPeriodView.of(q, clock.instant())).build();
    }

    @DELETE
    @Path("/{id}")
    @Operation(summary = "Lift a quiet period early: ?lifted_by=name")
    @APIResponse(responseCode = "204", description = "lifted")
    @APIResponse(responseCode = "400", description = "invalid-parameter: no lifted_by, or one too long or holding a control character")
    @APIResponse(responseCode = "404", description = "not-found: no active quiet period with this id (or an id that is not a number)")
    public Response lift(@PathParam("id") long id, @QueryParam("lifted_by") String liftedBy) {
        liftAs(id, liftedBy, "lifted_by");
        return Response.noContent().build();
    }

    /** A page of quiet periods, newest first, each shown by {@code view}; the one paging contract ({@link Paging}). */
    <V> RestResponse<List<V>> page(String limit, String after, UriInfo uri, View<V> view) {
        Instant now = clock.instant();
        int n = Paging.limit(limit, MAX_PER_PAGE, MAX_PER_PAGE);
        Long before = Cursors.rowId(after);
        // the desk holds every quiet period, newest (highest id) first
        List<QuietPeriodBook.QuietPeriod> fetched = desk.quietPeriods().stream().filter(q -> before == null || q.id() < before)
                .limit(n + 1L).toList();
        Paging.Page<QuietPeriodBook.QuietPeriod> page = Paging.Page.of(fetched, n, q -> Cursors.rowId(q.id()));
        List<V> items = page.items().stream().map(q -> view.of(q, now)).toList();
        return Paging.answer(items, Paging.next(uri, page));
    }

    /** How a list shows one quiet period at a moment. */
    @FunctionalInterface
    interface View<V> {
        V of(QuietPeriodBook.QuietPeriod q, Instant now);
    }

    /** Checks a request and keeps the quiet period it asks for, as the journal then holds it; a problem otherwise. */
    QuietPeriodBook.QuietPeriod keep(QuietPeriodRequest r) {
        if (r == null || blank(r.setBy()) || blank(r.note())) {
            throw ProblemException.invalidBody("a quiet period needs set_by and note, and one of rule or spread");
        }
        if (blank(r.rule()) == blank(r.spread())) {
            throw ProblemException.invalidBody("name exactly one of rule or spread");
        }
        String rule = blank(r.rule()) ? null : r.rule().strip();
        String spread = blank(r.spread()) ? null : r.spread().strip();
        String note = r.note().strip();
        String setBy = r.setBy().strip();
        String problem = new AlertRequests(policies.policy(), ingest.curves()).quietPeriod(rule, spread, note, setBy);
        if (problem != null) {
            throw ProblemException.invalidBody(problem);
        }
        Instant now = clock.instant();
        Instant until;
        try {
            until = !blank(r.until()) ? Instant.parse(r.until().strip())
                    : !blank(r.lasts()) ? now.plus(Duration.parse(r.lasts().strip())) : null;
        } catch (DateTimeException | ArithmeticException e) {
            // a duration too long for an instant overflows rather than failing to parse
            throw ProblemException.invalidBody("lasts must be an ISO-8601 duration (e.g. PT4H) and until an instant (e.g. "
                    + "2026-07-01T08:00:00Z), ending within " + LONGEST.toDays() + " days");
        }
        if (until == null || !until.isAfter(now) || until.isAfter(now.plus(LONGEST))) {
            throw ProblemException.invalidBody("a quiet period must end in the future and within " + LONGEST.toDays() + " days");
        }
        QuietPeriodBook.QuietPeriod q = rule != null ? desk.setQuietPeriod("rule", rule, until, note, setBy)
                : desk.setQuietPeriod("spread", spread, until, note, setBy);
        return kept(q.id()).orElse(q);
    }

    /** Lifts quiet period {@code id} as {@code liftedBy}, a query parameter called {@code parameter}; a problem otherwise. */
    void liftAs(long id, String liftedBy, String parameter) {
        if (blank(liftedBy)) {
            throw ProblemException.invalidParameter("say who lifts the quiet period: ?" + parameter + "=name");
        }
        String problem = AlertRequests.lift(liftedBy.strip());
        if (problem != null) {
            throw ProblemException.invalidParameter(problem);
        }
        if (!desk.lift(id, liftedBy.strip())) {
            throw ProblemException.notFound("no active quiet period " + id);
        }
    }

    /** A quiet period as the desk keeps it (all of them, read back from the journal after each change). */
    Optional<QuietPeriodBook.QuietPeriod> kept(long id) {
        return desk.quietPeriods().stream().filter(q -> q.id() == id).findFirst();
    }

    static URI location(long id) {
        return UriBuilder.fromPath("/api/quiet-periods/{id}").build(id);
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }
}
