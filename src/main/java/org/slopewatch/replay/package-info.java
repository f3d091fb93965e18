/**
 * Offline analysis of history files: the replay (history through the engine objects the daemon
 * uses, into a report of quarters, transitions, spells, lead times and one outcome per peak), the probit fit (one
 * spread's series read the same way, into a {@link org.slopewatch.replay.FitReport}), and the
 * what-if ({@link org.slopewatch.replay.WhatIf}: another policy's alert rules on stored history,
 * with market dates as the clock, compared with what fired live). Plain Java; opens no ports and
 * builds its own engines, so it never touches the daemon's state. A replay's spreads are listed
 * by curve name, so that the report of a file does not depend on how its rows interleave the
 * curves. Every report carries {@link org.slopewatch.replay.ReplayReport#CAUTION}.
 */
package org.slopewatch.replay;
