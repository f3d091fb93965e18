package org.slopewatch.web;

import java.io.IOException;

/** Writes an export row by row as the journal streams it; {@link #finish()} ends the document without closing the response. */
interface TableWriter {

    /** Values as the export's columns give them: String, Number, Boolean, LocalDate, Instant or null. */
    void row(Object[] values) throws IOException;

    void finish() throws IOException;
}
