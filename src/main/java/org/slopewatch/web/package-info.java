/**
 * The HTTP surface: quote submission and the read API under {@code /api}. Thin: decode, call
 * the pipeline or the journal, shape the answer.
 */
package org.slopewatch.web;
