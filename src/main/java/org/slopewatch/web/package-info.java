/**
 * The HTTP surface: quote submission, the read API under {@code /api}, and the dashboard at
 * {@code /} (static files under {@code META-INF/resources} that poll the read API like any other
 * client). Thin: decode, call the pipeline or the journal, shape the answer. What people send to
 * be kept (quiet periods, their lifts, acknowledgements) is checked first, in one place
 * ({@link org.slopewatch.web.AlertRequests}); an error answer repeats input only as an excerpt.
 * {@code /api/mutes}, the old path of {@code /api/quiet-periods}, is kept for one release with its
 * old fields and {@code Deprecation} and {@code Link} headers ({@link org.slopewatch.web.MuteAliasResource},
 * {@link org.slopewatch.web.Superseded}). Which policy each instance on the journal runs is read
 * from the journal ({@link org.slopewatch.web.PolicyFleetResource}).
 *
 * <p>Every list that grows with the journal is served a page at a time under one contract
 * ({@link org.slopewatch.web.Paging}), keeping the shape it always had; names are snake_case, old
 * spellings of query parameters are renamed before matching ({@link org.slopewatch.web.QueryAliases}).
 *
 * <p>Every error answer is an RFC 9457 problem document ({@link org.slopewatch.web.Problem}, of a
 * kind of {@link org.slopewatch.web.ProblemType}): resources throw a
 * {@link org.slopewatch.web.ProblemException} and never build an error body themselves;
 * {@link org.slopewatch.web.ProblemMapper} answers it and whatever the REST layer raises, and
 * {@link org.slopewatch.web.ProblemWriter} writes every problem, those of the route handlers
 * that answer before the REST layer included. {@link org.slopewatch.web.ApiDocument} adds to the
 * OpenAPI document what the annotations cannot say.
 */
package org.slopewatch.web;
