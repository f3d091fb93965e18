/**
 * Launcher commands. Offline commands drive the engine directly and open no ports; the daemon
 * commands hand over to Quarkus. Exit codes: 0 done, 1 failed, 2 bad input or usage.
 * {@code check-rules} is a hidden alias of {@code vet-policy} for one release.
 */
package org.slopewatch.cli;
