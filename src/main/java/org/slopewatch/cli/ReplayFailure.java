package org.slopewatch.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.NoSuchFileException;

/**
 * How {@code replay} (plain and what-if) and {@code backfill} report a failure and which exit code
 * they give: 2 for a problem with the input (its message, which already names file and line when it
 * has them), 1 for a file that cannot be read. One place, so they answer alike.
 */
final class ReplayFailure {

    private ReplayFailure() {
    }

    /** A problem with the input: the policy, the history or an option value. */
    static int input(Exception e, PrintWriter err) {
        return input("replay", e, err);
    }

    /** As {@link #input(Exception, PrintWriter)}, for {@code command}. */
    static int input(String command, Exception e, PrintWriter err) {
        String m = e.getMessage();
        // messages of file readers and the policy parser already start with file:line
        err.println(e instanceof IllegalArgumentException && !m.matches("(?s)\\S+:\\d+: .*") ? "slopewatch " + command + ": " + m : m);
        return 2;
    }

    /** A file that is missing or cannot be read. */
    static int unreadable(IOException e, PrintWriter err) {
        return unreadable("replay", e, err);
    }

    /** As {@link #unreadable(IOException, PrintWriter)}, for {@code command}. */
    static int unreadable(String command, IOException e, PrintWriter err) {
        err.println(e instanceof NoSuchFileException missing ? "slopewatch " + command + ": no such file: " + missing.getFile()
                : "slopewatch " + command + ": cannot read: " + e.getMessage());
        return 1;
    }
}
