package org.slopewatch.cli;

import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalException;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.replay.CandidatePolicy;
import org.slopewatch.replay.SpreadFilter;
import org.slopewatch.replay.WhatIf;
import org.slopewatch.replay.WhatIfReport;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.whatif.JournalWhatIf;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * The what-if of {@code slopewatch replay}: {@code --rules POLICY} tries another policy's alert
 * rules on a history file, or with {@code --from-journal} on a journal, and compares with what
 * fired there. A mixin, so that the replay command only hands over.
 */
final class WhatIfOptions {

    /** Replay options that mean nothing to a what-if: the policy tried says what to watch and how. */
    private static final Set<String> REPLAY_ONLY = Set.of("--policy", "--persistence", "--entry-bp", "--exit-bp",
            "--exit-observations", "--hold-days", "--recessions", "--false-alarm-months", "--transitions", "--report");
    private static final Set<String> FILE_ONLY = Set.of("--curve", "--unit");

    @Option(names = "--rules", paramLabel = "POLICY", description = "What-if: a policy file (or a directory holding one *.yaml) whose "
            + "alert rules to try on the history: what would fire and, with --from-journal, how it differs from what fired.")
    Path rules;

    @Option(names = "--from-journal", paramLabel = "JOURNAL", description = "What-if on a journal instead of FILE: a JDBC URL, or the "
            + "daemon's data directory holding journal.mv.db (H2: only while the daemon is stopped). User and password from "
            + "SLOPEWATCH_JOURNAL_USERNAME and SLOPEWATCH_JOURNAL_PASSWORD.")
    String journal;

    @Spec(Spec.Target.MIXEE)
    CommandSpec replay;

    /**
     * Runs the what-if if the command line asks for one.
     *
     * @return the exit code, or null when the plain replay is to run
     */
    Integer runIfAsked(Path file, String curve, String unit, List<String> spreads, boolean json) {
        PrintWriter err = replay.commandLine().getErr();
        if (rules == null) {
            if (journal != null) {
                return usage(err, "--from-journal needs --rules POLICY: the policy to try on the journal's history");
            }
            return file == null ? usage(err, "give a history FILE (or --rules POLICY --from-journal JOURNAL for a what-if)") : null;
        }
        if ((file == null) == (journal == null)) {
            return usage(err, "a what-if runs on a history FILE or on --from-journal JOURNAL: give exactly one");
        }
        String misplaced = given(journal == null ? REPLAY_ONLY : union(REPLAY_ONLY, FILE_ONLY));
        if (!misplaced.isEmpty()) {
            return usage(err, misplaced + " do" + (misplaced.contains(",") ? "" : "es") + " not apply to a what-if"
                    + (journal == null ? "" : " on a journal") + ": the policy tried says what to watch and how");
        }
        try {
            CandidatePolicy policy = policy(rules);
            SpreadFilter filter = SpreadFilter.of(spreads);
            WhatIfReport report = journal == null ? onFile(file, curve, unit, policy, filter) : onJournal(JournalLocation.of(journal), policy, filter);
            PrintWriter out = replay.commandLine().getOut();
            if (json) {
                ReportJson.write(report, out);
            } else {
                new WhatIfText(out).print(report);
            }
            return 0;
        } catch (PolicyException | HistoryFormatException | IllegalArgumentException e) {
            return ReplayFailure.input(e, err);
        } catch (IOException e) {
            return ReplayFailure.unreadable(e, err);
        } catch (JournalException e) {
            err.println("slopewatch replay: " + (JournalLocation.inUse(e) ? "the journal " + journal + " is in use by another process: an H2 journal"
                    + " can be read while the daemon is stopped; on a running daemon use POST /api/what-if"
                    : e.getMessage() + ": " + ServeCommand.rootMessage(e).lines().findFirst().orElse("")));
            return 1;
        }
    }

    /** The policy tried: the file, or the one policy file in a directory (policies are tried whole, never merged). */
    static CandidatePolicy policy(Path path) throws IOException, PolicyException {
        List<Path> files = VetPolicyCommand.policyFiles(path);
        if (files.isEmpty()) {
            throw new IllegalArgumentException("no policy file (*.yaml, *.yml) in " + path);
        }
        if (files.size() > 1) {
            throw new IllegalArgumentException(path + " holds " + files.size() + " policy files (" + files.stream()
                    .map(f -> f.getFileName().toString()).collect(Collectors.joining(", ")) + "): name one with --rules; a policy"
                    + " is tried whole, never merged with another");
        }
        Path f = files.get(0);
        return CandidatePolicy.parse(f.toString(), Files.readAllBytes(f));
    }

    private static WhatIfReport onFile(Path file, String curve, String unit, CandidatePolicy policy, SpreadFilter filter)
            throws IOException, HistoryFormatException {
        WhatIf whatIf = new WhatIf(policy, filter);
        HistoryCsvReader.Options options = new HistoryCsvReader.Options(curve, YieldUnit.parse(unit), YieldBounds.DEFAULT);
        try (InputStream raw = Files.newInputStream(file); CountingInputStream in = new CountingInputStream(raw);
             ProgressBar bar = ProgressBar.forStderr("what-if", Files.size(file))) {
            HistoryCsvReader.read(file.toString(), in, options, whatIf::snapshot, () -> bar.update(in.count()));
        }
        return whatIf.report(file.toString(), null);
    }

    private static WhatIfReport onJournal(JournalLocation location, CandidatePolicy policy, SpreadFilter filter) {
        try (AgroalDataSource ds = JournalDatabase.open(location.url(), System.getenv("SLOPEWATCH_JOURNAL_USERNAME"),
                System.getenv("SLOPEWATCH_JOURNAL_PASSWORD"), 2)) {
            return new JournalWhatIf(new JournalReader(ds), new AlertHistory(ds))
                    .run(location.label(), policy, filter, taken -> { });
        }
    }

    private String given(Set<String> names) {
        return replay.commandLine().getParseResult().matchedOptions().stream().map(OptionSpec::longestName)
                .filter(names::contains).distinct().sorted().collect(Collectors.joining(", "));
    }

    private static Set<String> union(Set<String> a, Set<String> b) {
        return java.util.stream.Stream.concat(a.stream(), b.stream()).collect(Collectors.toSet());
    }

    private static int usage(PrintWriter err, String message) {
        err.println("slopewatch replay: " + message);
        return 2;
    }
}
