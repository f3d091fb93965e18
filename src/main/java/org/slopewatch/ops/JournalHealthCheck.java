package org.slopewatch.ops;

import jakarta.enterprise.context.ApplicationScoped;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.Readiness;
import org.slopewatch.journal.JournalReader;

/** Ready only while the journal answers: without it nothing can be accepted safely. */
@Readiness
@ApplicationScoped
public class JournalHealthCheck implements HealthCheck {

    private final JournalReader journal;

    JournalHealthCheck(JournalReader journal) {
        this.journal = journal;
    }

    @Override
    public HealthCheckResponse call() {
        return HealthCheckResponse.named("journal").status(journal.reachable()).build();
    }
}
