/**
 * Operations: metrics (Micrometer, scraped at {@code /q/metrics}), health checks (journal,
 * feed freshness) and the clock.
 *
 * <p>Invariants: metrics are side outputs, never a path for the data; tag values are bounded.
 */
package org.slopewatch.ops;
