package org.slopewatch.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code slopewatch vet-policy DIR}: validates policy files without starting anything. A sound file
 * is summed up as {@code FILE: policy sound: N spread(s), M alert rule(s), K channel(s)}, after its
 * warnings (deprecated keys) if it has any; a file with problems gets every problem.
 */
@Command(name = "vet-policy", mixinStandardHelpOptions = true,
        description = "Validates the policy files (*.yaml, *.yml) in a directory, or one file: every problem as file:line:column: message.",
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:every file is valid", "1:a file could not be read", "2:a file has problems, or there is no policy file"})
final class VetPolicyCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "DIR", description = "A directory of policy files, or one policy file.")
    Path path;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        return run(spec.commandLine().getOut(), spec.commandLine().getErr());
    }

    int run(PrintWriter out, PrintWriter err) {
        List<Path> files;
        try {
            files = policyFiles(path);
        } catch (IOException e) {
            err.println("slopewatch vet-policy: cannot read " + path + ": " + e.getMessage());
            return 1;
        }
        if (files.isEmpty()) {
            err.println("slopewatch vet-policy: no policy file (*.yaml, *.yml) in " + path);
            return 2;
        }
        int code = 0;
        for (Path f : files) {
            try {
                Policy p = PolicyParser.parse(f.toString(), Files.readAllBytes(f));
                p.warnings().forEach(err::println);
                out.printf("%s: policy sound: %d spread(s), %d alert rule(s), %d channel(s)%n", f,
                        p.watches().size(), p.alerts().size(), p.channels().size());
            } catch (PolicyException e) {
                err.println(e.getMessage());
                code = Math.max(code, 2);
            } catch (IOException e) {
                err.println("slopewatch vet-policy: cannot read " + f + ": " + e.getMessage());
                code = Math.max(code, 1);
            }
        }
        return code;
    }

    static List<Path> policyFiles(Path path) throws IOException {
        if (!Files.isDirectory(path)) {
            if (!Files.exists(path)) {
                throw new java.nio.file.NoSuchFileException(path.toString());
            }
            return List.of(path);
        }
        try (Stream<Path> s = Files.list(path)) {
            return s.filter(p -> {
                String n = p.getFileName().toString();
                return Files.isRegularFile(p) && (n.endsWith(".yaml") || n.endsWith(".yml"));
            }).sorted().toList();
        }
    }
}
