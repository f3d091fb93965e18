/**
 * The HTTP surface: quote submission, the read API under {@code /api}, and the dashboard at
 * {@code /} (static files under {@code META-INF/resources} that poll the read API like any other
 * client). Thin: decode, call the pipeline or the journal, shape the answer.
 */
package org.slopewatch.web;
