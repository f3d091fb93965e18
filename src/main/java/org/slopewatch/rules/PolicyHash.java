package org.slopewatch.rules;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * The name of a policy's content: lower-case hex SHA-256 of the file's bytes as read. The
 * journal records it with every rule set applied and every alert, and reports and what-if
 * answers show it, so all of them must compute it the same way: here.
 */
public final class PolicyHash {

    private PolicyHash() {
    }

    public static String of(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
