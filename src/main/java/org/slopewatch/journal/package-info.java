/**
 * The journal: accepted quotes, rejects, spread observations, transitions, spells and revisions
 * in one schema (Flyway migrations in {@code db/journal}) for H2 and PostgreSQL, written with
 * plain batched JDBC.
 *
 * <p>Invariants: one processing step is one transaction, on disk when the write returns
 * ({@link org.slopewatch.journal.JournalDurability}: H2 without write delay and forced after each
 * commit, PostgreSQL with {@code synchronous_commit} on), so that nothing is answered for before it
 * is durable; rows are stamped with the time they were recorded; transitions are never deleted
 * (a revision marks them superseded); the in-memory state can always be rebuilt by replaying the
 * quotes in recorded order. The API's lists are read a page at a time after a position in a total
 * order of their own (keys the database compares itself, so that a page boundary never splits or
 * repeats a row).
 */
package org.slopewatch.journal;
