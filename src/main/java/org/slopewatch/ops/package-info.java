/**
 * Operations: metrics (Micrometer, scraped at {@code /q/metrics}), health checks (journal,
 * feed freshness), the clock, and the log guard every log record passes
 * ({@link org.slopewatch.ops.LogGuard}, with the secret settings it masks in
 * {@link org.slopewatch.ops.SecretSettings}).
 *
 * <p>Invariants: metrics are side outputs, never a path for the data; tag values are bounded; no
 * log record written by any handler holds a configured secret or a line break.
 */
package org.slopewatch.ops;
