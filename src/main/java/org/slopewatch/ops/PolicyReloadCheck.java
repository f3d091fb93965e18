package org.slopewatch.ops;

import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.util.Optional;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.pipeline.PolicyReloader;

/**
 * DOWN while the policy file on disk is rejected ({@link PolicyReloader#rejected()}): the desk
 * edited its policy and the change is not in force, the previous policy runs on. Wellness: the
 * daemon works as before, it only does not do what the file says.
 */
@Wellness
@ApplicationScoped
public class PolicyReloadCheck implements HealthCheck {

    private final PolicyReloader reloader;
    private final PolicyHolder policies;

    PolicyReloadCheck(PolicyReloader reloader, PolicyHolder policies) {
        this.reloader = reloader;
        this.policies = policies;
    }

    @Override
    public HealthCheckResponse call() {
        PolicyHolder.Loaded current = policies.current();
        HealthCheckResponseBuilder b = HealthCheckResponse.named("policy reload").up()
                .withData("in force", current.source() + " (sha256 " + current.hash() + ")");
        Optional<PolicyReloader.Rejection> rejected = reloader.rejected();
        if (rejected.isPresent()) {
            PolicyReloader.Rejection r = rejected.get();
            b.down().withData("rejected", r.file() + " as found at " + r.at() + r.contentHash().map(h -> " (sha256 " + h + ")").orElse("")
                    + ": the previous policy keeps running").withData("problems", r.problems().size());
            if (!r.problems().isEmpty()) {
                b.withData("first problem", r.problems().get(0));
            }
        }
        return b.build();
    }
}
