package org.slopewatch.cli;

import io.quarkus.runtime.annotations.QuarkusMain;
import java.io.PrintWriter;
import picocli.CommandLine;

/**
 * The launcher's entry point.
 *
 * <p>Offline commands ({@code replay}, {@code fit}, {@code vet-policy}) run as plain
 * Java through picocli: they open no ports and start no container. Only the daemon commands
 * boot Quarkus.
 */
@QuarkusMain
public final class SlopewatchMain {

    private SlopewatchMain() {
    }

    public static void main(String... args) {
        System.exit(execute(args));
    }

    /** Runs one command line and returns its exit code (0 ok, 1 failure, 2 bad input or usage). */
    public static int execute(String... args) {
        return execute(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args);
    }

    /** As {@link #execute(String...)}, writing to the given streams (tests read them). */
    public static int execute(PrintWriter out, PrintWriter err, String... args) {
        CommandLine cli = new CommandLine(new SlopewatchCommand())
                .setCaseInsensitiveEnumValuesAllowed(true)
                .setOut(out)
                .setErr(err);
        int code = cli.execute(args);
        out.flush();
        err.flush();
        return code;
    }
}
