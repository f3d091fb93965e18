package org.slopewatch.web;

import jakarta.inject.Singleton;
import java.time.Instant;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.PolicyVersions;

/**
 * Which rule set was in force at a moment, named by its content hash: the last policy version
 * journalled as applied at or before it. Every history answer carries it, because what the
 * monitor concluded depends on the rules as much as on the quotes.
 */
@Singleton
public class RuleSetAt {

    private final PolicyHolder policies;
    private final PolicyVersions store;

    RuleSetAt(PolicyHolder policies, PolicyVersions store) {
        this.policies = policies;
        this.store = store;
    }

    /** The hash in force at {@code asOf}, or the one in force now when it is null; null before any policy was journalled. */
    public String hash(Instant asOf) {
        return asOf == null ? policies.current().hash() : store.policyHashAt(asOf);
    }

    /** The hash of the rules in force now. */
    public String current() {
        return policies.current().hash();
    }
}
