package org.slopewatch.rules;

/** One thing wrong in a policy file, at a 1-based line and column. */
public record PolicyProblem(String file, int line, int column, String message) {

    @Override
    public String toString() {
        return file + ":" + line + ":" + column + ": " + message;
    }
}
