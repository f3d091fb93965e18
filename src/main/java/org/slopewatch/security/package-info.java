/**
 * Access to the HTTP API: bearer tokens with a read or a write role, kept only as SHA-256 hashes
 * and compared in constant time ({@link org.slopewatch.security.TokenBook}), and the one rule that
 * says which request needs which role ({@link org.slopewatch.security.AccessRule}), applied to
 * every request before it reaches a resource ({@link org.slopewatch.security.AccessFilter}).
 */
package org.slopewatch.security;
