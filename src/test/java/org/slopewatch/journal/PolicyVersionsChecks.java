package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * Policy versions, the same checks on H2 and PostgreSQL: the policy in force is the last one
 * applied; a rejected one never is.
 */
abstract class PolicyVersionsChecks extends AlertJournalFixture {

    @Test
    void aRejectedVersionIsNotInForce() {
        PolicyVersions store = new PolicyVersions(database(), clock);

        assertThat(store.currentPolicyHash()).isNull();
        store.policyVersion("h1", "alert-rules/default.yaml", "applied", "loaded at start-up");
        store.policyVersion("h2", "alert-rules/default.yaml", "rejected", "p.yaml:3:1: unknown key");
        assertThat(store.currentPolicyHash()).as("a rejected version is not in force").isEqualTo("h1");
    }
}
