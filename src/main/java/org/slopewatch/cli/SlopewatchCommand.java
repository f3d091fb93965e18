package org.slopewatch.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** The top-level command: lists the subcommands. */
@Command(name = "slopewatch",
        mixinStandardHelpOptions = true,
        versionProvider = BuildVersion.class,
        description = "Watches government yield-curve spreads for persistent inversions.%n"
                + "A statistical signal, not investment advice.",
        subcommands = {DemoCommand.class, ServeCommand.class, ReplayCommand.class, FitCommand.class, BackfillCommand.class,
                VetPolicyCommand.class,
                CheckRulesAlias.class})
final class SlopewatchCommand implements Callable<Integer> {

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    /** No command is a usage error: the usage goes to stderr and the exit code is 2, as for any other. */
    @Override
    public Integer call() {
        spec.commandLine().getErr().println("slopewatch: a command is needed");
        spec.commandLine().usage(spec.commandLine().getErr());
        return 2;
    }
}
