package org.slopewatch.alerting;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyHash;
import org.slopewatch.rules.PolicyParser;

/**
 * The policy in force, with the content hash that names it in the journal. Replaced as a whole
 * by a reload, so a reader sees either the old set or the new one, never a mixture. Plain Java:
 * the pipeline's beans create it from the configured file, and its reloader replaces it.
 */
public class PolicyHolder {

    /** A parsed policy, its SHA-256 content hash (hex) and the file it came from. */
    public record Loaded(Policy policy, String hash, String source) {
    }

    private volatile Loaded current;

    public PolicyHolder(Loaded initial) {
        this.current = initial;
    }

    public Loaded current() {
        return current;
    }

    public Policy policy() {
        return current.policy();
    }

    /** Puts a new policy in force; only the reloader does, after the pipeline and the alert desk took it. */
    public void replace(Loaded next) {
        this.current = next;
    }

    /** Reads and parses a policy file; the hash is of its bytes as read. */
    public static Loaded read(String file) throws IOException, PolicyException {
        byte[] bytes = Files.readAllBytes(Path.of(file));
        Policy policy = PolicyParser.parse(file, bytes);
        return new Loaded(policy, PolicyHash.of(bytes), file);
    }
}
