package org.slopewatch.security;

/**
 * What a request needs before it may go on, as {@link AccessRule} decides it: nothing, a token
 * with a role, or nothing at all will do because the request is malformed.
 */
public sealed interface Access {

    /** Goes on without a token. */
    record Open() implements Access {
    }

    /** Goes on with a token whose role covers {@code role}. */
    record Token(Role role) implements Access {
    }

    /** Refused whatever the token: {@code reason} says why, in a few words. */
    record Malformed(String reason) implements Access {
    }
}
