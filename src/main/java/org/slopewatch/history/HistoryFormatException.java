package org.slopewatch.history;

import org.slopewatch.text.Excerpt;

/**
 * Bad input in a history file, with the place it was found: {@code file:line:column: what is
 * wrong}, line and column counted from 1 (columns in characters). The problem is cut to
 * {@link #MAX_PROBLEM} characters, control characters escaped: it may repeat what the file
 * holds, and it is answered over HTTP and printed.
 */
public final class HistoryFormatException extends Exception {

    static final int MAX_PROBLEM = 1_000;

    private final String source;
    private final long line;
    private final int column;
    private final String problem;

    public HistoryFormatException(String source, long line, int column, String problem) {
        super(source + ":" + line + ":" + column + ": " + Excerpt.cut(problem, MAX_PROBLEM));
        this.source = source;
        this.line = line;
        this.column = column;
        this.problem = Excerpt.cut(problem, MAX_PROBLEM);
    }

    HistoryFormatException(String source, TextPosition at, String problem) {
        this(source, at.line(), at.column(), problem);
    }

    public String source() {
        return source;
    }

    public long line() {
        return line;
    }

    public int column() {
        return column;
    }

    public String problem() {
        return problem;
    }
}
