package org.slopewatch.history;

/** A place in a text file: line and column, both counted from 1. Prints as {@code line:column}. */
record TextPosition(long line, int column) {

    @Override
    public String toString() {
        return line + ":" + column;
    }
}
