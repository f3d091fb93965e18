package org.slopewatch.security;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;

/**
 * The tokens that may use the API, each with its role, held only as SHA-256 hashes: a token given
 * in plain text in configuration is hashed at start and the text dropped; one given as
 * {@code sha256:<64 hex digits>} is taken as is, so a deployment need never write the token itself
 * to disk. A presented token is hashed and compared with every stored hash with
 * {@link MessageDigest#isEqual}, without stopping at a match, so the time taken says nothing about
 * which token, or how much of one, was right.
 */
public final class TokenBook {

    private static final String HASHED = "sha256:";

    private record Entry(byte[] hash, Role role) {
    }

    private final List<Entry> entries;

    private TokenBook(List<Entry> entries) {
        this.entries = List.copyOf(entries);
    }

    /** @param readTokens and {@code writeTokens}: plain tokens or {@code sha256:<hex>} */
    public static TokenBook of(List<String> readTokens, List<String> writeTokens) {
        List<Entry> entries = new ArrayList<>();
        for (String t : readTokens) {
            entries.add(new Entry(hashOf(t, "read"), Role.READ));
        }
        for (String t : writeTokens) {
            entries.add(new Entry(hashOf(t, "write"), Role.WRITE));
        }
        return new TokenBook(entries);
    }

    public boolean isEmpty() {
        return entries.isEmpty();
    }

    public boolean hasWriteToken() {
        return entries.stream().anyMatch(e -> e.role() == Role.WRITE);
    }

    /** The role of a presented token, or empty when it is none of ours. */
    public Optional<Role> roleOf(String presented) {
        byte[] hash = sha256(presented);
        Role found = null;
        for (Entry e : entries) {
            // no early exit: every stored hash is compared
            if (MessageDigest.isEqual(hash, e.hash()) && (found == null || e.role() == Role.WRITE)) {
                found = e.role();
            }
        }
        return Optional.ofNullable(found);
    }

    private static byte[] hashOf(String configured, String which) {
        String t = configured.strip();
        if (t.regionMatches(true, 0, HASHED, 0, HASHED.length())) {
            String hex = t.substring(HASHED.length());
            if (!hex.matches("[0-9a-fA-F]{64}")) {
                throw new IllegalArgumentException("a hashed " + which + " token must be sha256: followed by 64 hex digits");
            }
            return HexFormat.of().parseHex(hex.toLowerCase(java.util.Locale.ROOT));
        }
        if (t.length() < 16) {
            // the value is not shown: it is a secret, even a weak one
            throw new IllegalArgumentException("a " + which + " token must be at least 16 characters long");
        }
        return sha256(t);
    }

    /** The SHA-256 of a token's UTF-8 bytes, as the {@code sha256:} form stores it. */
    public static byte[] sha256(String token) {
        try {
            return MessageDigest.getInstance("SHA-256").digest(token.getBytes(StandardCharsets.UTF_8));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
