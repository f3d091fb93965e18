/**
 * Benchmarks of the engine's speed targets: the monitor per observation and the replay per quote,
 * each next to a baseline measured in the same run. Not tests (surefire excludes bench/);
 * {@code bench/run.sh} builds, runs them and writes {@code docs/benchmarks.md}.
 *
 * <p>Inputs are synthetic and deterministic (fixed seeds), so two runs see the same data.
 */
package org.slopewatch.bench;
