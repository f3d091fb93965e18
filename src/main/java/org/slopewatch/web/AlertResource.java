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
import java.time.Clock;
import java.time.DateTimeException;
import java.time.Duration;
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
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.journal.MuteBook;
import org.slopewatch.journal.NewestAlerts;
import org.slopewatch.pipeline.PolicyReloader;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.text.Excerpt;

/** Alerts for people: the list with deliveries, acknowledgements, mutes, and a policy reload on demand. */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class AlertResource {

    /** Notices a page holds at most; unless {@code limit} says otherwise, {@link #ALERTS_BY_DEFAULT}. */
    static final int MAX_ALERTS = 1000;
    static final int ALERTS_BY_DEFAULT = 100;
    /** Mutes a page holds at most, and unless {@code limit} says otherwise. */
    static final int MAX_MUTES = 1000;
    private static final Duration LONGEST_MUTE = Duration.ofDays(90);

    private final AlertDesk desk;
    private final AlertHistory store;
    private final DeliveryAttempts deliveryAttempts;
    private final NewestAlerts newest;
    private final PolicyReloader reloader;
    private final Clock clock;
    private final RuleSetAt ruleSets;
    private final PolicyHolder policies;
    private final IngestRules ingest;

    AlertResource(AlertDesk desk, AlertHistory store, DeliveryAttempts deliveryAttempts, NewestAlerts newest, PolicyReloader reloader,
                  Clock clock, RuleSetAt ruleSets, PolicyHolder policies, IngestRules ingest) {
        this.desk = desk;
        this.store = store;
        this.deliveryAttempts = deliveryAttempts;
        this.newest = newest;
        this.reloader = reloader;
        this.clock = clock;
        this.ruleSets = ruleSets;
        this.policies = policies;
        this.ingest = ingest;
    }

    /** One open episode: a rule whose condition holds for a subject. */
    public record EpisodeView(String rule, String subject, String since, int notices, boolean acknowledged) {
    }

    /** Every open episode, and a page of the notices, newest first ({@code next}: where the rest is when {@code truncated}). */
    public record AlertsView(List<EpisodeView> open, List<AlertView> recent, boolean truncated, String next, String caution) {
    }

    public record DeliveryView(String channel, String status, int attempts, Instant nextAttemptAt, String lastDetail, Instant updatedAt) {
    }

    public record AckView(String by, String note, Instant at) {
    }

    public record AlertView(String id, String rule, String severity, String kind, String subject, String marketDate, String state,
                            String title, String text, List<Alert.Fact> facts, String dashboard, String mutedBy, String policyHash,
                            Instant createdAt, List<DeliveryView> deliveries, List<AckView> acks) {

        static AlertView of(AlertHistory.AlertView v) {
            Alert a = v.stored().alert();
            return new AlertView(a.id(), a.rule(), a.severity().name(), a.kind().name(), v.stored().subject(),
                    a.marketDate() == null ? null : a.marketDate().toString(), a.state(), a.subject(), a.text(), a.facts(), a.dashboard(),
                    v.stored().mutedBy(), v.stored().policyHash(), a.createdAt(),
                    v.deliveries().stream().map(d -> new DeliveryView(d.channel(), d.status().name(), d.attempts(), d.nextAttemptAt(),
                            d.lastDetail(), d.updatedAt())).toList(),
                    v.acks().stream().map(k -> new AckView(k.by(), k.note(), k.at())).toList());
        }
    }

    /**
     * The notices recorded at or before {@code as_of}, with their deliveries and acknowledgements
     * as they stood then. Open episodes are left out: a rule without a resolve notice ends its
     * episode without a journal row, so the journal cannot say which were open at a past moment.
     */
    public record AlertsAsOf(Instant asOf, String policyHash, List<AlertView> items, boolean truncated, String next, String note,
                             String caution) {
    }

    /** One alert with every delivery attempt, for a post-mortem. */
    public record AlertDetail(AlertView alert, List<DeliveryAttempts.Attempt> attempts) {
    }

    public record AckRequest(String by, String note) {
    }

    /** A mute as kept, and whether it silences notices now. */
    public record MuteView(long id, String kind, String target, Instant until, String reason, String by, Instant createdAt,
                           boolean active) {

        static MuteView of(MuteBook.Mute m, Instant now) {
            return new MuteView(m.id(), m.kind(), m.target(), m.until(), m.reason(), m.by(), m.createdAt(), m.activeAt(now));
        }
    }

    /** Mute a rule or a spread (id such as GOVT-A:10Y-3M, or a spread name for every curve) for a while. */
    public record MuteRequest(String rule, String spread, String duration, String until, String reason, String by) {
    }

    @GET
    @Path("/alerts")
    @Operation(summary = "Open alert episodes and the most recent notices with their deliveries and acknowledgements; with as_of, "
            + "the notices recorded by then as they stood then")
    @APIResponse(responseCode = "200", description = "open episodes and recent notices; with as_of, the notices as they stood then",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(oneOf = {AlertsView.class, AlertsAsOf.class})))
    @APIResponse(responseCode = "400", description = "invalid-parameter: as_of is not an instant, limit not a whole number from 1, "
            + "after not a cursor of this list")
    public RestResponse<Object> alerts(@QueryParam("limit") String limit, @QueryParam("as_of") String asOf,
                                       @QueryParam("after") String after, @Context UriInfo uri) {
        Instant at = QueryParams.asOf(asOf);
        int n = Paging.limit(limit, ALERTS_BY_DEFAULT, MAX_ALERTS);
        Paging.Page<AlertHistory.AlertView> page = Paging.Page.of(newest.page(n + 1, at, Cursors.alert(after)), n, Cursors::alert);
        List<AlertView> items = page.items().stream().map(AlertView::of).toList();
        String next = Paging.next(uri, page);
        if (at != null) {
            return Paging.answer(new AlertsAsOf(at, ruleSets.hash(at), items, page.truncated(), next, "deliveries as they stood at as_of, "
                    + "replayed from their journalled attempts (next_attempt_at is known only for a delivery not yet attempted); open "
                    + "episodes are not journalled", Alert.CAUTION), next);
        }
        List<EpisodeView> open = new ArrayList<>();
        for (Map.Entry<String, AlertEngine.Episode> e : desk.openEpisodes().entrySet()) {
            String[] key = e.getKey().split("\\|", 2);
            open.add(new EpisodeView(key[0], key[1], String.valueOf(e.getValue().since()), e.getValue().notices(),
                    Instant.MAX.equals(e.getValue().lastNotice())));
        }
        open.sort(java.util.Comparator.comparing(EpisodeView::rule).thenComparing(EpisodeView::subject));
        return Paging.answer(new AlertsView(open, items, page.truncated(), next, Alert.CAUTION), next);
    }

    @GET
    @Path("/alerts/{id}")
    @Operation(summary = "One alert with its deliveries, acknowledgements and every delivery attempt")
    @APIResponse(responseCode = "200", description = "the alert")
    @APIResponse(responseCode = "404", description = "not-found: no alert with this id")
    public AlertDetail alert(@PathParam("id") String id) {
        AlertHistory.AlertView v = store.find(id);
        if (v == null) {
            throw ProblemException.notFound("no alert " + Excerpt.of(id));
        }
        return new AlertDetail(AlertView.of(v), deliveryAttempts.attempts(id));
    }

    @POST
    @Path("/alerts/{id}/ack")
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Acknowledge an alert: its episode sends no more repeats; journalled with who and when")
    @APIResponse(responseCode = "200", description = "the alert, acknowledged",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = AlertView.class)))
    @APIResponse(responseCode = "400", description = "invalid-body: no by, a field too long or holding a control character, or not JSON")
    @APIResponse(responseCode = "404", description = "not-found: no alert with this id")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: the body is not application/json")
    public Response acknowledge(@PathParam("id") String id, AckRequest request) {
        if (request == null || blank(request.by())) {
            throw ProblemException.invalidBody("say who acknowledges: {\"by\": \"name\", \"note\": \"optional\"}");
        }
        String by = request.by().strip();
        String note = request.note() == null ? null : request.note().strip();
        String problem = AlertRequests.ack(by, note);
        if (problem != null) {
            throw ProblemException.invalidBody(problem);
        }
        // the answer is the alert as it now stands, which GET /api/alerts/{id} serves too (RFC 9110, 8.7)
        return desk.acknowledge(id, by, note)
                .map(v -> Response.ok(AlertView.of(v)).header("Content-Location", alertPath(v.stored().alert().id())).build())
                .orElseThrow(() -> ProblemException.notFound("no alert " + Excerpt.of(id)));
    }

    @GET
    @Path("/mutes")
    @Operation(summary = "Mutes, newest first, with whether each is active")
    public RestResponse<List<MuteView>> mutes(@QueryParam("limit") String limit, @QueryParam("after") String after,
                                              @Context UriInfo uri) {
        Instant now = clock.instant();
        int n = Paging.limit(limit, MAX_MUTES, MAX_MUTES);
        Long before = Cursors.rowId(after);
        // the desk holds every mute, newest (highest id) first
        List<MuteView> fetched = desk.mutes().stream().filter(m -> before == null || m.id() < before).limit(n + 1L)
                .map(m -> MuteView.of(m, now)).toList();
        Paging.Page<MuteView> page = Paging.Page.of(fetched, n, m -> Cursors.rowId(m.id()));
        String next = Paging.next(uri, page);
        return Paging.answer(page.items(), next);
    }

    @GET
    @Path("/mutes/{id}")
    @Operation(summary = "One mute, with whether it is active")
    @APIResponse(responseCode = "200", description = "the mute")
    @APIResponse(responseCode = "404", description = "not-found: no mute with this id")
    public MuteView mute(@PathParam("id") long id) {
        Instant now = clock.instant();
        return kept(id).map(m -> MuteView.of(m, now)).orElseThrow(() -> ProblemException.notFound("no mute " + id));
    }

    @POST
    @Path("/mutes")
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Mute a rule or a spread for a period (ISO-8601 duration such as PT4H, or an until time) with a reason")
    @APIResponse(responseCode = "201", description = "the mute made",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = MuteView.class)))
    @APIResponse(responseCode = "400", description = "invalid-body: a field missing, too long or holding a control character, a rule "
            + "or spread the policy in force does not know, an end not in the next 90 days, or not JSON")
    @APIResponse(responseCode = "415", description = "unsupported-media-type: the body is not application/json")
    public Response mute(MuteRequest r) {
        if (r == null || blank(r.by()) || blank(r.reason())) {
            throw ProblemException.invalidBody("a mute needs by and reason, and one of rule or spread");
        }
        if (blank(r.rule()) == blank(r.spread())) {
            throw ProblemException.invalidBody("name exactly one of rule or spread");
        }
        String rule = blank(r.rule()) ? null : r.rule().strip();
        String spread = blank(r.spread()) ? null : r.spread().strip();
        String reason = r.reason().strip();
        String by = r.by().strip();
        String problem = new AlertRequests(policies.policy(), ingest.curves()).mute(rule, spread, reason, by);
        if (problem != null) {
            throw ProblemException.invalidBody(problem);
        }
        Instant now = clock.instant();
        Instant until;
        try {
            until = !blank(r.until()) ? Instant.parse(r.until().strip())
                    : !blank(r.duration()) ? now.plus(Duration.parse(r.duration().strip())) : null;
        } catch (DateTimeException | ArithmeticException e) {
            // a duration too long for an instant overflows rather than failing to parse
            throw ProblemException.invalidBody("duration must be ISO-8601 (e.g. PT4H) and until an instant (e.g. 2026-07-01T08:00:00Z), "
                    + "ending within " + LONGEST_MUTE.toDays() + " days");
        }
        if (until == null || !until.isAfter(now) || until.isAfter(now.plus(LONGEST_MUTE))) {
            throw ProblemException.invalidBody("a mute must end in the future and within " + LONGEST_MUTE.toDays() + " days");
        }
        MuteBook.Mute m = rule != null ? desk.mute("rule", rule, until, reason, by) : desk.mute("spread", spread, until, reason, by);
        // answered as kept, so that it reads the same as from its Location (the journal keeps instants to the microsecond)
        return Response.created(UriBuilder.fromPath("/api/mutes/{id}").build(m.id())).entity(MuteView.of(kept(m.id()).orElse(m), now))
                .build();
    }

    @DELETE
    @Path("/mutes/{id}")
    @Operation(summary = "Lift a mute early")
    @APIResponse(responseCode = "204", description = "lifted")
    @APIResponse(responseCode = "400", description = "invalid-parameter: no by, or one too long or holding a control character")
    @APIResponse(responseCode = "404", description = "not-found: no active mute with this id (or an id that is not a number)")
    public Response lift(@PathParam("id") long id, @QueryParam("by") String by) {
        if (blank(by)) {
            throw ProblemException.invalidParameter("say who lifts the mute: ?by=name");
        }
        String problem = AlertRequests.lift(by.strip());
        if (problem != null) {
            throw ProblemException.invalidParameter(problem);
        }
        if (!desk.lift(id, by.strip())) {
            throw ProblemException.notFound("no active mute " + id);
        }
        return Response.noContent().build();
    }

    @POST
    @Path("/policy/reload")
    @Operation(summary = "Check the policy file now and apply it if it changed and is valid")
    @APIResponse(responseCode = "200", description = "applied, or unchanged")
    @APIResponse(responseCode = "422", description = "policy-rejected: the file has problems (in detail, one per line); the policy in "
            + "force keeps running")
    public PolicyReloader.Outcome reload() {
        PolicyReloader.Outcome o = reloader.check();
        if ("rejected".equals(o.result())) {
            Map<String, Object> outcome = new LinkedHashMap<>();
            outcome.put("result", o.result());
            outcome.put("hash", o.hash());
            throw new ProblemException(ProblemType.POLICY_REJECTED, o.detail(), outcome);
        }
        return o;
    }

    /** A mute as the desk keeps it (all of them, read back from the journal after each change). */
    private Optional<MuteBook.Mute> kept(long id) {
        return desk.mutes().stream().filter(m -> m.id() == id).findFirst();
    }

    /** The path of one alert, its id escaped as a path segment needs (ids use {@code ~} so that they seldom need it). */
    static String alertPath(String id) {
        return UriBuilder.fromPath("/api/alerts/{id}").build(id).toString();
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }
}
