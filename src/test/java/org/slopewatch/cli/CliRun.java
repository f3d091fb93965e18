package org.slopewatch.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** One run of the launcher's command line, with what it printed. */
record CliRun(int exitCode, String out, String err) {

    static CliRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = SlopewatchMain.execute(new PrintWriter(out), new PrintWriter(err), args);
        return new CliRun(code, out.toString(), err.toString());
    }
}
