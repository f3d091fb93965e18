package org.slopewatch.ingest;

/** Bad input in a history file, with the place it was found: {@code file:line: what is wrong}. */
public final class HistoryFormatException extends Exception {

    private final String source;
    private final long line;
    private final String problem;

    public HistoryFormatException(String source, long line, String problem) {
        super(source + ":" + line + ": " + problem);
        this.source = source;
        this.line = line;
        this.problem = problem;
    }

    public String source() {
        return source;
    }

    public long line() {
        return line;
    }

    public String problem() {
        return problem;
    }
}
