/**
 * Reports for people: one self-contained HTML file (inline CSS, charts as inline SVG drawn by
 * JFreeChart onto JFreeSVG, no external requests) built from a replay or from the journal. A page
 * opens with its findings, taken from what the replay or the daemon already computed (one finding
 * per peak, as the lead-time analysis decided it, never regrouped here); a
 * probability is always said with its spread, horizon, month and model. Plain Java: no container,
 * no clock reads (the generation time comes in with the document), and every report carries
 * {@link org.slopewatch.replay.ReplayReport#CAUTION}.
 */
package org.slopewatch.report;
