/**
 * Offline analysis of history files: the replay (history through the engine objects the daemon
 * uses, into a report of quarters, transitions, spells and lead times) and the probit fit (one
 * spread's series read the same way, into a {@link org.slopewatch.replay.FitReport}). Plain Java;
 * opens no ports. Every report carries {@link org.slopewatch.replay.ReplayReport#CAUTION}.
 */
package org.slopewatch.replay;
