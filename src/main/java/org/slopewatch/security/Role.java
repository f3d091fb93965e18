package org.slopewatch.security;

/** What a token may do. A write token may also read. */
public enum Role {
    READ, WRITE;

    boolean covers(Role needed) {
        return this == WRITE || needed == READ;
    }
}
