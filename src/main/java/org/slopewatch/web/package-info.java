/**
 * The HTTP surface: quote submission, the read API under {@code /api}, and the dashboard at
 * {@code /} (static files under {@code META-INF/resources} that poll the read API like any other
 * client). Thin: decode, call the pipeline or the journal, shape the answer. What people send to
 * be kept (quiet periods, their lifts, acknowledgements) is checked first, in one place
 * ({@link org.slopewatch.web.AlertRequests}); an error answer repeats input only as an excerpt.
 * {@code /api/mutes}, the old path of {@code /api/quiet-periods}, is kept for one release with its
 * old fields and a {@code Deprecation} header ({@link org.slopewatch.web.MuteAliasResource}).
 */
package org.slopewatch.web;
