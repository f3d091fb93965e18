/**
 * Launcher commands. Offline commands drive the engine directly and open no ports; the daemon
 * commands hand over to Quarkus. Exit codes: 0 done, 1 failed, 2 bad input or usage.
 * {@code vet-policy} also answers to its old name for one release, hidden ({@code CheckRulesAlias}).
 */
package org.slopewatch.cli;
