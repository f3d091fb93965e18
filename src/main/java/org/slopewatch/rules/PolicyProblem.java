package org.slopewatch.rules;

import org.slopewatch.text.Excerpt;

/**
 * One thing wrong in a policy file, at a 1-based line and column. The message is cut to
 * {@link #MAX_MESSAGE} characters: values it quotes are excerpts already, but it may also list
 * names the file declared (channels, spreads), and the file may declare long ones.
 */
public record PolicyProblem(String file, int line, int column, String message) {

    static final int MAX_MESSAGE = 1_000;

    public PolicyProblem {
        message = Excerpt.cut(message, MAX_MESSAGE);
    }

    @Override
    public String toString() {
        return file + ":" + line + ":" + column + ": " + message;
    }
}
