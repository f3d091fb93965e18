/**
 * The what-if over a journal: reads the stored quotes and the notices that fired into
 * {@link org.slopewatch.replay.WhatIf} ({@link org.slopewatch.whatif.JournalWhatIf}, used by the
 * command line and the daemon), and runs what-ifs for the API as bounded background jobs with
 * progress ({@link org.slopewatch.whatif.WhatIfJobs}), kept as journal rows so that every instance on
 * the journal answers for a job one of them runs (its report stored as JSON by {@code WhatIfResults}).
 *
 * <p>Invariant: reads the journal and writes only its own jobs' rows, and builds engines of its own; the daemon's pipeline, rule
 * engine and policy in force are never touched.
 */
package org.slopewatch.whatif;
