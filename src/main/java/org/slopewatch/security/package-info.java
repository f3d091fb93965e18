/**
 * Access to the HTTP API: bearer tokens with a read or a write role, kept only as SHA-256 hashes
 * and compared in constant time ({@link org.slopewatch.security.TokenBook}), and the one rule that
 * says which request needs which role ({@link org.slopewatch.security.AccessRule}), applied to
 * every request before it reaches a resource ({@link org.slopewatch.security.AccessFilter}).
 *
 * <p>Invariants: access is denied by default. A request goes on without a token only when it
 * reads and its raw path (as sent: not decoded, not normalised) is exactly one of the open paths
 * listed in {@link org.slopewatch.security.AccessRule} (health, the dashboard's files, the metrics
 * unless closed), or, with open reads, an API path already in normal form
 * ({@link org.slopewatch.security.RawPath}). Every other request needs the read role (GET, HEAD,
 * OPTIONS) or the write role (any other method), whatever layer would answer it. A path with a
 * matrix parameter is refused with 400. Refusals never repeat the token and are counted in the HTTP
 * metrics under one {@code uri} label ({@link org.slopewatch.security.RefusedRequests}). Refusals
 * are the API's problem documents ({@link org.slopewatch.web.Problem}); the OpenAPI document
 * declares the bearer scheme on the operations the rule says need a token
 * ({@link org.slopewatch.security.AccessDocument}).
 */
package org.slopewatch.security;
