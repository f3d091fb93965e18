package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
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
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.journal.NewestAlerts;
import org.slopewatch.pipeline.PolicyReloader;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.text.Excerpt;

/** Alerts for people: the list with deliveries and acknowledgements, and a policy reload on demand (quiet periods: {@link QuietPeriodResource}). */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class AlertResource {

    /** Notices a page holds at most; unless {@code limit} says otherwise, {@link #ALERTS_BY_DEFAULT}. */
    static final int MAX_ALERTS = 1000;
    static final int ALERTS_BY_DEFAULT = 100;

    private final AlertDesk desk;
    private final AlertHistory store;
    private final DeliveryAttempts deliveryAttempts;
    private final NewestAlerts newest;
    private final PolicyReloader reloader;
    private final RuleSetAt ruleSets;

    AlertResource(AlertDesk desk, AlertHistory store, DeliveryAttempts deliveryAttempts, NewestAlerts newest, PolicyReloader reloader,
                  RuleSetAt ruleSets) {
        this.desk = desk;
        this.store = store;
        this.deliveryAttempts = deliveryAttempts;
        this.newest = newest;
        this.reloader = reloader;
        this.ruleSets = ruleSets;
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
                            String title, String text, List<Alert.Fact> facts, String dashboard, String quietedBy, String policyHash,
                            Instant createdAt, List<DeliveryView> deliveries, List<AckView> acks) {

        static AlertView of(AlertHistory.AlertView v) {
            Alert a = v.stored().alert();
            return new AlertView(a.id(), a.rule(), a.severity().name(), a.kind().label(), v.stored().subject(),
                    a.marketDate() == null ? null : a.marketDate().toString(), a.state(), a.subject(), a.text(), a.facts(), a.dashboard(),
                    v.stored().quietedBy(), v.stored().policyHash(), a.createdAt(),
                    v.deliveries().stream().map(d -> new DeliveryView(d.channel(), d.status().name(), d.attempts(), d.nextAttemptAt(),
                            d.lastDetail(), d.updatedAt())).toList(),
                    v.acks().stream().map(k -> new AckView(k.by(), k.note(), k.at())).toList());
        }
    }

    /**
     * The notices recorded at or before {@code as_of}, with their deliveries and acknowledgements
     * as they stood then. Open episodes are left out: a rule without a closing notice ends its
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
    @Operation(summary = "Acknowledge an alert: its episode sends no more standing notices; journalled with who and when")
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

    /** The path of one alert, its id escaped as a path segment needs (ids use {@code ~} so that they seldom need it). */
    static String alertPath(String id) {
        return UriBuilder.fromPath("/api/alerts/{id}").build(id).toString();
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }
}
