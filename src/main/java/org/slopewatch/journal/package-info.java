/**
 * The journal: accepted quotes, rejects, spread observations, transitions, spells and revisions,
 * and the alert tables (notices, their outbox and attempts, acknowledgements, quiet periods, policy
 * versions) in one schema (Flyway migrations in {@code db/journal}) for H2 and PostgreSQL, written
 * with plain JDBC. {@link org.slopewatch.journal.JournalWriter} writes a step, its quote and
 * spread-value rows in bulk ({@code BulkRows}: {@code COPY} on PostgreSQL, a batched insert on H2)
 * and its notices with their outbox rows ({@code AlertRows}); a large step's rows go to a writer
 * thread in parts while the rest of it is decided ({@code StepWrite}), still one transaction; each alert table is read and written
 * through a store with one job ({@code AlertHistory}, {@code DeliveryOutbox},
 * {@code DeliveryAttempts}, {@code Acknowledgements}, {@code QuietPeriodBook}, {@code PolicyVersions}),
 * the counter that every quiet period, lift and acknowledgement moves in its own transaction, so that
 * every instance on the journal notices ({@code DeskChanges}), the API's what-if jobs, readable from
 * any instance ({@code WhatIfRows}), the fetches of pulled sources through {@code SourceFetches}, the
 * policy each instance runs and the reloads the instances accepted through {@code PolicyInForce}, and
 * the API's pages of notices and of a spread's timeline are read by {@code NewestAlerts} and
 * {@code TimelineRows}; all of them go through {@code JournalSql}, the one JDBC helper.
 *
 * <p>Invariants: one processing step is one transaction, on disk when the write returns
 * ({@link org.slopewatch.journal.JournalDurability}: H2 without write delay and forced after each
 * commit, PostgreSQL with {@code synchronous_commit} on), and so is every write of an alert store,
 * so that nothing is answered for, and no delivery attempt is recorded, before it is durable; rows
 * are stamped with the time they were recorded; transitions are never deleted (a revision marks
 * them superseded); a notice id is stored once; the in-memory state can always be rebuilt by
 * replaying the quotes in recorded order. The API's lists are read a page at a time after a
 * position in a total order of their own (keys the database compares itself, so that a page
 * boundary never splits or repeats a row).
 */
package org.slopewatch.journal;
