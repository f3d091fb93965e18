/**
 * Operations: metrics (Micrometer, scraped at {@code /q/metrics}), health checks, the clock, and
 * the log guard every log record passes ({@link org.slopewatch.ops.LogGuard}, with the secret
 * settings it masks in {@link org.slopewatch.ops.SecretSettings}). Readiness holds only what taking
 * and journalling quotes needs ({@link org.slopewatch.ops.JournalHealthCheck}); whether the desk
 * can rely on what it receives is the wellness group: alert channels, deliveries, the policy
 * reload, the policy in force across the live instances ({@link org.slopewatch.ops.PolicyFleetCheck}), feed freshness and pulled sources ({@link org.slopewatch.ops.PulledSourcesCheck},
 * {@link org.slopewatch.ops.SourceMetrics}).
 *
 * <p>Invariants: metrics are side outputs, never a path for the data; tag values are bounded; no
 * log record written by any handler holds a configured secret or a line break; a health check
 * only reports a rule kept elsewhere (channel reach, failing channels, freshness, the instances' heartbeats), never a copy of
 * it, and its open answer carries no address and no delivery reason.
 */
package org.slopewatch.ops;
