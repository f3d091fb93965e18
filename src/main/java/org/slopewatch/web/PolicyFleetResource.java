package org.slopewatch.web;

import jakarta.ws.rs.GET;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.Produces;
import jakarta.ws.rs.QueryParam;
import jakarta.ws.rs.core.Context;
import jakarta.ws.rs.core.MediaType;
import jakarta.ws.rs.core.UriInfo;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.Operation;
import org.eclipse.microprofile.openapi.annotations.media.Content;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.eclipse.microprofile.openapi.annotations.responses.APIResponse;
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.journal.PolicyInForce;
import org.slopewatch.pipeline.FleetConfig;
import org.slopewatch.pipeline.PolicyFleet;

/** Which policy each instance on the journal runs: the fleet's side of a reload (the reload itself: {@link AlertResource}). */
@Path("/api")
@Produces(MediaType.APPLICATION_JSON)
public class PolicyFleetResource {

    /** Instances a page holds at most; unless {@code limit} says otherwise, {@link #INSTANCES_BY_DEFAULT}. */
    static final int MAX_INSTANCES = 1000;
    static final int INSTANCES_BY_DEFAULT = 100;

    private final PolicyInForce store;
    private final PolicyFleet fleet;
    private final FleetConfig config;
    private final Clock clock;

    PolicyFleetResource(PolicyInForce store, PolicyFleet fleet, FleetConfig config, Clock clock) {
        this.store = store;
        this.fleet = fleet;
        this.config = config;
        this.clock = clock;
    }

    /**
     * One instance as it last wrote.
     *
     * @param live       its heartbeat is within {@code live_within} of now
     * @param waitingFor the hash of a reload accepted elsewhere that its file did not give yet, or null
     */
    public record InstanceView(String instance, String hash, String source, Instant since, Instant lastSeen, boolean live,
                               String waitingFor) {
    }

    /** A page of instances in the order they first appeared, with this instance's id and the heartbeat bound (ISO 8601). */
    public record InstancesView(String thisInstance, String liveWithin, List<InstanceView> items, boolean truncated, String next) {
    }

    @GET
    @Path("/policy/instances")
    @Operation(summary = "Every instance that wrote to this journal: the policy it runs (SHA-256 and file), since when, when it was "
            + "last seen, whether it is live and which accepted reload it still waits for; in the order they first appeared")
    @APIResponse(responseCode = "200", description = "a page of instances",
            content = @Content(mediaType = MediaType.APPLICATION_JSON, schema = @Schema(implementation = InstancesView.class)))
    @APIResponse(responseCode = "400", description = "invalid-parameter: limit not a whole number from 1, after not a cursor of this list")
    public RestResponse<InstancesView> instances(@QueryParam("limit") String limit, @QueryParam("after") String after,
                                                 @Context UriInfo uri) {
        int n = Paging.limit(limit, INSTANCES_BY_DEFAULT, MAX_INSTANCES);
        Paging.Page<PolicyInForce.Instance> page = Paging.Page.of(store.page(n + 1, Cursors.rowId(after)), n, i -> Cursors.rowId(i.id()));
        Instant bound = clock.instant().minus(config.liveWithin());
        List<InstanceView> items = page.items().stream().map(i -> new InstanceView(i.instance(), i.hash(), i.source(), i.since(),
                i.lastSeen(), !i.lastSeen().isBefore(bound), i.waitingFor())).toList();
        String next = Paging.next(uri, page);
        return Paging.answer(new InstancesView(fleet.instance(), config.liveWithin().toString(), items, page.truncated(), next), next);
    }
}
