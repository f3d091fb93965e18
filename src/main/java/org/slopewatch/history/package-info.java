/**
 * History files: the reader of slopewatch's CSV of past quotes
 * ({@link org.slopewatch.history.HistoryCsvReader}) and its format errors, placed at
 * {@code line:column}. Plain Java, no framework and no clock: used alike by the offline
 * commands ({@code replay}, {@code fit}), the reports, the what-if runs and CSV ingest.
 */
package org.slopewatch.history;
