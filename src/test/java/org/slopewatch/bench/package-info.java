/**
 * Benchmarks of the engine's speed targets: the monitor per observation and the replay per quote,
 * each next to a baseline measured in the same run; and the replay end to end against parse-only and
 * the same computation in pandas ({@code bench/replay-peers.sh}, {@code bench/replay_pandas.py}). Not tests (surefire excludes bench/);
 * {@code bench/run.sh} builds, runs them and writes {@code docs/benchmarks.md}.
 *
 * <p>Inputs are synthetic and deterministic (fixed seeds), so two runs see the same data.
 */
package org.slopewatch.bench;
