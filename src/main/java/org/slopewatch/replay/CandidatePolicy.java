package org.slopewatch.replay;

import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyHash;
import org.slopewatch.rules.PolicyParser;

/**
 * A policy tried in a what-if, named by the SHA-256 of its file's bytes: the same hash the daemon
 * journals for the policy in force, so a reviewer can tell whether the policy tried is one that
 * has run live.
 *
 * @param source where it was read from (a file name, or {@code policy} for an API request)
 * @param sha256 lowercase hex SHA-256 of the bytes as read
 */
public record CandidatePolicy(String source, Policy policy, String sha256) {

    /**
     * Parses a policy file's bytes as {@link PolicyParser#parse(String, byte[])} reads them; every
     * problem is reported as {@code file:line:column: message}.
     */
    public static CandidatePolicy parse(String source, byte[] bytes) throws PolicyException {
        Policy policy = PolicyParser.parse(source, bytes);
        return new CandidatePolicy(source, policy, sha256(bytes));
    }

    static String sha256(byte[] bytes) {
        return PolicyHash.of(bytes);
    }
}
