package org.slopewatch.pipeline;

import java.util.Optional;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.PolicyInForce;

/**
 * This instance's part in a fleet on one journal. Each check (every {@code slopewatch.fleet.check-every},
 * scheduled by {@link PipelineBeans}) asks the journal for the newest reload any instance
 * accepted; when it is newer than the one this instance last took, this instance reloads its own
 * policy file for that content ({@link PolicyReloader#follow}); while its file gives other content
 * (a ConfigMap not yet propagated) it changes nothing, says so, and tries again at the next check.
 * Then it writes which policy it runs, with a heartbeat.
 *
 * <p>Reloads accepted before this instance started are not followed: at start-up an instance runs
 * its own file, as a fresh rollout does, and a stale file shows as a disagreement in the wellness
 * check rather than dragging the others back.
 */
public class PolicyFleet {

    private static final Logger LOG = Logger.getLogger(PolicyFleet.class);

    private final PolicyReloader reloader;
    private final PolicyHolder policies;
    private final PolicyInForce store;
    private final String instance;
    // the id of the newest accepted reload this instance has taken (or found at start-up)
    private long taken;
    private volatile Waiting waiting;

    /** A reload accepted elsewhere that this instance's file does not give yet. */
    public record Waiting(PolicyInForce.AcceptedReload reload, String detail) {
    }

    public PolicyFleet(PolicyReloader reloader, PolicyHolder policies, PolicyInForce store, String instance) {
        this.reloader = reloader;
        this.policies = policies;
        this.store = store;
        this.instance = instance;
        this.taken = store.newestReload().map(PolicyInForce.AcceptedReload::id).orElse(0L);
        store.seen(instance, policies.current().hash(), policies.current().source(), null);
        LOG.infof("instance %s on the journal, policy sha256 %s", instance, policies.current().hash());
    }

    /** Follows the newest accepted reload if it is new here, then writes the heartbeat. */
    public synchronized void check() {
        Optional<PolicyInForce.AcceptedReload> newest = store.newestReload();
        if (newest.isPresent() && newest.get().id() > taken) {
            PolicyInForce.AcceptedReload reload = newest.get();
            PolicyReloader.Outcome outcome = reloader.follow(reload.hash());
            if ("applied".equals(outcome.result()) || "unchanged".equals(outcome.result())) {
                taken = reload.id();
                waiting = null;
            } else {
                if (waiting == null || waiting.reload().id() != reload.id()) {
                    LOG.warnf("reload accepted on %s at %s (sha256 %s) not taken yet: %s", reload.instance(), reload.acceptedAt(),
                            reload.hash(), outcome.detail());
                }
                waiting = new Waiting(reload, outcome.detail());
            }
        }
        Waiting w = waiting;
        PolicyHolder.Loaded current = policies.current();
        store.seen(instance, current.hash(), current.source(), w == null ? null : w.reload().hash());
    }

    void checkQuietly() {
        try {
            check();
        } catch (RuntimeException e) {
            LOG.warnf("policy fleet check failed: %s", e.getMessage());
        }
    }

    /** This instance's id in the journal. */
    public String instance() {
        return instance;
    }

    /** The reload accepted elsewhere that this instance's file does not give yet, if any. */
    public Optional<Waiting> waiting() {
        return Optional.ofNullable(waiting);
    }
}
