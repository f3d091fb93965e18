/**
 * History files: the reader of slopewatch's CSV of past quotes
 * ({@link org.slopewatch.history.HistoryCsvReader}), and of the layouts in which statisticians
 * publish yields (the Treasury's par yield curve, the H.15 download, SDMX-CSV placed by a
 * {@link org.slopewatch.history.SeriesMap}), each recognised from its header in one place
 * ({@link org.slopewatch.history.Layout}), and its format errors, placed at {@code line:column}. Plain Java, no framework and no clock: used alike by the offline
 * commands ({@code replay}, {@code fit}), the reports, the what-if runs and CSV ingest.
 *
 * <p>Invariants: every snapshot handed on is bond-equivalent, in basis points, its bills spelt in
 * weeks on their month points (a declared discount basis converted, a wide column's by its
 * {@link org.slopewatch.history.TenorHeading}, a long row's by its {@code basis} cell, through
 * {@link org.slopewatch.curve.YieldBasis}); each curve's snapshots come in date order, a long
 * file's rows in any order that keeps each curve's dates ascending, with one snapshot per curve
 * held at a time ({@link org.slopewatch.history.OpenSnapshots}); what cannot be placed stops the
 * read, never a part of a file passed off as whole.
 */
package org.slopewatch.history;
