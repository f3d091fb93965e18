package org.slopewatch.cli;

import io.quarkus.runtime.annotations.QuarkusMain;
import picocli.CommandLine;

/**
 * The launcher's entry point.
 *
 * <p>Offline commands ({@code replay}, and later {@code check-rules}, {@code fit}) run as plain
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
        return new CommandLine(new SlopewatchCommand())
                .setCaseInsensitiveEnumValuesAllowed(true)
                .execute(args);
    }
}
