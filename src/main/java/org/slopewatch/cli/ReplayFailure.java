package org.slopewatch.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.NoSuchFileException;

/**
 * How {@code replay} (plain and what-if) reports a failure and which exit code it gives: 2 for a
 * problem with the input (its message, which already names file and line when it has them), 1
 * for a file that cannot be read. One place, so both modes answer alike.
 */
final class ReplayFailure {

    private ReplayFailure() {
    }

    /** A problem with the input: the policy, the history or an option value. */
    static int input(Exception e, PrintWriter err) {
        String m = e.getMessage();
        // messages of file readers and the policy parser already start with file:line
        err.println(e instanceof IllegalArgumentException && !m.matches("(?s)\\S+:\\d+: .*") ? "slopewatch replay: " + m : m);
        return 2;
    }

    /** A file that is missing or cannot be read. */
    static int unreadable(IOException e, PrintWriter err) {
        err.println(e instanceof NoSuchFileException missing ? "slopewatch replay: no such file: " + missing.getFile()
                : "slopewatch replay: cannot read: " + e.getMessage());
        return 1;
    }
}
