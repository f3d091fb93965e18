package org.slopewatch.ingest;

import org.slopewatch.text.Excerpt;

/**
 * Bad input in a history file, with the place it was found: {@code file:line: what is wrong}. The
 * problem is cut to {@link #MAX_PROBLEM} characters, control characters escaped: it may repeat
 * what the file holds, and it is answered over HTTP and printed.
 */
public final class HistoryFormatException extends Exception {

    static final int MAX_PROBLEM = 1_000;

    private final String source;
    private final long line;
    private final String problem;

    public HistoryFormatException(String source, long line, String problem) {
        super(source + ":" + line + ": " + Excerpt.cut(problem, MAX_PROBLEM));
        this.source = source;
        this.line = line;
        this.problem = Excerpt.cut(problem, MAX_PROBLEM);
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
