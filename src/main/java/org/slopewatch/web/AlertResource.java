package org.slopewatch.web;

import jakarta.ws.rs.Consumes;
import jakarta.ws.rs.DefaultValue;
import jakarta.ws.rs.GET;
import jakarta.ws.rs.POST;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.PathParam;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.Response;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.pipeline.PolicyReloader;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.text.Excerpt;

/** Alerts for people: the list with deliveries and acknowledgements, and a policy reload on demand (quiet periods: {@link QuietPeriodResource}). */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class AlertResource {

    private static final int MAX_ALERTS = 1000;

    private final AlertDesk desk;
    private final AlertHistory store;
    private final DeliveryAttempts deliveryAttempts;
    private final PolicyReloader reloader;
    private final RuleSetAt ruleSets;

    AlertResource(AlertDesk desk, AlertHistory store, DeliveryAttempts deliveryAttempts, PolicyReloader reloader,
                  RuleSetAt ruleSets) {
        this.desk = desk;
        this.store = store;
        this.deliveryAttempts = deliveryAttempts;
        this.reloader = reloader;
        this.ruleSets = ruleSets;
    }

    /** One open episode: a rule whose condition holds for a subject. */
    public record EpisodeView(String rule, String subject, String since, int notices, boolean acknowledged) {
    }

    public record AlertsView(List<EpisodeView> open, List<AlertView> recent, String caution) {
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
    public record AlertsAsOf(Instant asOf, String policyHash, List<AlertView> items, String note, String caution) {
    }

    /** One alert with every delivery attempt, for a post-mortem. */
    public record AlertDetail(AlertView alert, List<DeliveryAttempts.Attempt> attempts) {
    }

    public record AckRequest(String by, String note) {
    }

    @GET
    @Path("/alerts")
    @Operation(summary = "Open alert episodes and the most recent notices with their deliveries and acknowledgements; with asOf, "
            + "the notices recorded by then as they stood then")
    public Object alerts(@QueryParam("limit") @DefaultValue("100") int limit, @QueryParam("asOf") String asOf) {
        Instant at = QueryParams.asOf(asOf);
        if (at != null) {
            List<AlertView> items = store.recent(Math.max(1, Math.min(limit, MAX_ALERTS)), at).stream().map(AlertView::of).toList();
            return new AlertsAsOf(at, ruleSets.hash(at), items, "deliveries as they stood at as_of, replayed from their journalled "
                    + "attempts (next_attempt_at is known only for a delivery not yet attempted); open episodes are not journalled", Alert.CAUTION);
        }
        List<EpisodeView> open = new ArrayList<>();
        for (Map.Entry<String, AlertEngine.Episode> e : desk.openEpisodes().entrySet()) {
            String[] key = e.getKey().split("\\|", 2);
            open.add(new EpisodeView(key[0], key[1], String.valueOf(e.getValue().since()), e.getValue().notices(),
                    Instant.MAX.equals(e.getValue().lastNotice())));
        }
        open.sort(java.util.Comparator.comparing(EpisodeView::rule).thenComparing(EpisodeView::subject));
        List<AlertView> recent = store.recent(Math.max(1, Math.min(limit, MAX_ALERTS))).stream().map(AlertView::of).toList();
        return new AlertsView(open, recent, Alert.CAUTION);
    }

    @GET
    @Path("/alerts/{id}")
    @Operation(summary = "One alert with its deliveries, acknowledgements and every delivery attempt")
    public Response alert(@PathParam("id") String id) {
        AlertHistory.AlertView v = store.find(id);
        return v == null ? error(Response.Status.NOT_FOUND, "no alert " + Excerpt.of(id))
                : Response.ok(new AlertDetail(AlertView.of(v), deliveryAttempts.attempts(id))).build();
    }

    @POST
    @Path("/alerts/{id}/ack")
    @Consumes(MediaType.APPLICATION_JSON)
    @Operation(summary = "Acknowledge an alert: its episode sends no more standing notices; journalled with who and when")
    public Response acknowledge(@PathParam("id") String id, AckRequest request) {
        if (request == null || blank(request.by())) {
            return error(Response.Status.BAD_REQUEST, "say who acknowledges: {\"by\": \"name\", \"note\": \"optional\"}");
        }
        String by = request.by().strip();
        String note = request.note() == null ? null : request.note().strip();
        String problem = AlertRequests.ack(by, note);
        if (problem != null) {
            return error(Response.Status.BAD_REQUEST, problem);
        }
        return desk.acknowledge(id, by, note)
                .map(v -> Response.ok(AlertView.of(v)).build())
                .orElseGet(() -> error(Response.Status.NOT_FOUND, "no alert " + Excerpt.of(id)));
    }

    @POST
    @Path("/policy/reload")
    @Operation(summary = "Check the policy file now and apply it if it changed and is valid")
    public Response reload() {
        PolicyReloader.Outcome o = reloader.check();
        return Response.status("rejected".equals(o.result()) ? 422 : 200).entity(o).build();
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }

    private static Response error(Response.Status status, String message) {
        return Response.status(status).type(MediaType.APPLICATION_JSON).entity(Map.of("error", message)).build();
    }
}
