package org.slopewatch.ingest;

/**
 * Bad input in a history file, with the place it was found: {@code file:line:column: what is
 * wrong}, line and column counted from 1 (columns in characters).
 */
public final class HistoryFormatException extends Exception {

    private final String source;
    private final long line;
    private final int column;
    private final String problem;

    public HistoryFormatException(String source, long line, int column, String problem) {
        super(source + ":" + line + ":" + column + ": " + problem);
        this.source = source;
        this.line = line;
        this.column = column;
        this.problem = problem;
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
