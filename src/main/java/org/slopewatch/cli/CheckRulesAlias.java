package org.slopewatch.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code slopewatch check-rules DIR}: the name {@code vet-policy} had before, kept hidden for one
 * release (vocabulary: deprecation path). It says so on stderr and then does what
 * {@code vet-policy} does, with its output and exit codes.
 */
@Command(name = "check-rules", hidden = true, mixinStandardHelpOptions = true,
        description = "Deprecated: the old name of vet-policy.")
final class CheckRulesAlias implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "DIR", description = "A directory of policy files, or one policy file.")
    Path path;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        spec.commandLine().getErr().println("slopewatch: 'check-rules' is deprecated and will be removed; use 'vet-policy'");
        VetPolicyCommand vet = new VetPolicyCommand();
        vet.path = path;
        return vet.run(spec.commandLine().getOut(), spec.commandLine().getErr());
    }
}
