/**
 * Launcher commands. Offline commands drive the engine directly and open no ports ({@code backfill}
 * drives the daemon's pipeline on a journal the daemon must not hold open); the daemon commands hand
 * over to Quarkus. Replay, fit and backfill read history files with one set of options
 * ({@code HistoryReading}). Exit codes: 0 done, 1 failed, 2 bad input or usage.
 * {@code vet-policy} also answers to its old name for one release, hidden ({@code CheckRulesAlias}).
 */
package org.slopewatch.cli;
