package org.slopewatch.cli;

import picocli.CommandLine.Command;

/** The top-level command: lists the subcommands. */
@Command(name = "slopewatch",
        mixinStandardHelpOptions = true,
        version = "slopewatch 0.1.0",
        description = "Watches government yield-curve spreads for persistent inversions.%n"
                + "A statistical signal, not investment advice.",
        subcommands = {DemoCommand.class, ServeCommand.class, ReplayCommand.class, FitCommand.class, CheckRulesCommand.class})
final class SlopewatchCommand implements Runnable {

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(System.out);
    }
}
