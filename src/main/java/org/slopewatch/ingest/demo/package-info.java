/**
 * The demo feed: invented curves ({@code GOVT-A} through a tightening cycle, {@code GOVT-B} that
 * never inverts) simulated by a seeded two-factor short-rate model with a scripted policy gap, one
 * {@link org.slopewatch.curve.CurveSnapshot} per curve per business day, for as long as it is read.
 *
 * <p>Invariants: the same seed and start date give the same snapshots on any JVM; dates come from
 * the caller's start date and advance Monday to Friday, and nothing here reads a clock or depends
 * on Quarkus; yields are in basis points on a bond-equivalent basis. No real market data is used.
 * How fast the days go by on the wall clock is {@link org.slopewatch.ingest.demo.DemoPace}'s one
 * rule, which the feed service follows; the scenario itself never depends on it.
 */
package org.slopewatch.ingest.demo;
