/**
 * Reports for people: one self-contained HTML file (inline CSS, charts as inline SVG drawn by
 * JFreeChart onto JFreeSVG, no external requests) built from a replay or from the journal. Plain
 * Java: no container, no clock reads (the generation time comes in with the document), and every
 * report carries {@link org.slopewatch.replay.ReplayReport#CAUTION}.
 */
package org.slopewatch.report;
