package org.slopewatch.ops;

import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.time.Clock;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.TreeSet;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.journal.PolicyInForce;
import org.slopewatch.pipeline.FleetConfig;
import org.slopewatch.pipeline.PolicyFleet;

/**
 * DOWN while the live instances on the journal (a heartbeat within {@code slopewatch.fleet.live-within})
 * run different policies, or while this instance waits for its file to give a reload accepted
 * elsewhere: one desk, two rule sets. Each live instance is named with its policy's hash and
 * since when it runs it. Wellness: every instance works, they only do not all do what the desk
 * last accepted.
 */
@Wellness
@ApplicationScoped
public class PolicyFleetCheck implements HealthCheck {

    static final String NAME = "policy in force";

    private final PolicyInForce store;
    private final PolicyFleet fleet;
    private final FleetConfig config;
    private final Clock clock;

    PolicyFleetCheck(PolicyInForce store, PolicyFleet fleet, FleetConfig config, Clock clock) {
        this.store = store;
        this.fleet = fleet;
        this.config = config;
        this.clock = clock;
    }

    @Override
    public HealthCheckResponse call() {
        HealthCheckResponseBuilder b = HealthCheckResponse.named(NAME).up().withData("this instance", fleet.instance());
        if (config.checkEvery().isZero() || config.checkEvery().isNegative()) {
            return b.withData("fleet", "not checked (slopewatch.fleet.check-every is 0)").build();
        }
        List<PolicyInForce.Instance> live = store.seenSince(clock.instant().minus(config.liveWithin()));
        Map<String, TreeSet<String>> byHash = new TreeMap<>();
        for (PolicyInForce.Instance i : live) {
            byHash.computeIfAbsent(i.hash(), h -> new TreeSet<>()).add(i.instance());
            b.withData(i.instance(), "sha256 " + i.hash() + " since " + i.since()
                    + (i.waitingFor() == null ? "" : ", waiting for its file to give sha256 " + i.waitingFor()));
        }
        b.withData("live instances", live.size());
        if (byHash.size() > 1) {
            StringBuilder text = new StringBuilder();
            byHash.forEach((hash, names) -> text.append(text.length() == 0 ? "" : "; ").append(String.join(", ", names))
                    .append(" run sha256 ").append(hash));
            b.down().withData("disagreement", text.toString());
        }
        Optional<PolicyFleet.Waiting> waiting = fleet.waiting();
        if (waiting.isPresent()) {
            PolicyInForce.AcceptedReload r = waiting.get().reload();
            b.down().withData("waiting", "a reload accepted on " + r.instance() + " at " + r.acceptedAt() + " (sha256 " + r.hash()
                    + ") is not in force here: " + waiting.get().detail() + "; tried again every " + config.checkEvery());
        }
        return b.build();
    }
}
