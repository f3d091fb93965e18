package org.slopewatch.history;

/**
 * Counts lines and columns over text as the CSV parser counts lines: CR, LF and CR LF each end one
 * line, inside quoted fields too. Columns count characters from 1, a surrogate pair as one
 * character, so that a column matches what an editor shows rather than UTF-16 code units.
 */
final class PositionCounter {

    private long line;
    private int column = 1;
    private char previous;

    /** Starts at column 1 of {@code line}. */
    PositionCounter(long line) {
        this.line = line;
    }

    void advance(char c) {
        if (c == '\n') {
            if (previous != '\r') {
                line++;
            }
            column = 1;
        } else if (c == '\r') {
            line++;
            column = 1;
        } else if (!(Character.isLowSurrogate(c) && Character.isHighSurrogate(previous))) {
            column++;
        }
        previous = c;
    }

    long line() {
        return line;
    }

    /** The position of the next character. */
    TextPosition position() {
        return new TextPosition(line, column);
    }
}
