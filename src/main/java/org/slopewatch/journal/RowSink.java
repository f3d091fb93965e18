package org.slopewatch.journal;

import java.io.IOException;

/**
 * Takes journal rows one at a time as a query streams them, so that an export of any size
 * passes through without being held in memory. May throw the I/O error of the client it
 * writes to; the query then stops.
 */
@FunctionalInterface
public interface RowSink<T> {

    void accept(T row) throws IOException;
}
