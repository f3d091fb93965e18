/**
 * Reports for people: one self-contained HTML file (inline CSS, charts as inline SVG drawn by
 * JFreeChart onto JFreeSVG, no external requests) built from a replay or from the journal. A page
 * opens with its findings, regrouped from numbers the replay or the daemon already computed (lead
 * times per confirmation become one finding per peak, credited to its first confirmation); a
 * probability is always said with its spread, horizon, month and model. Plain Java: no container,
 * no clock reads (the generation time comes in with the document), and every report carries
 * {@link org.slopewatch.replay.ReplayReport#CAUTION}.
 */
package org.slopewatch.report;
