package org.slopewatch.cli;

import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalException;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.HistoryBackfill;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.pipeline.CurveOwnership;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.pipeline.StandingQuotes;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code slopewatch backfill FILE...}: history files into the journal through the daemon's own step.
 * Every file is read and checked whole before the journal is opened, so a bad file commits nothing.
 */
@Command(name = "backfill", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Loads history files into the journal in bulk, through the daemon's own pipeline: the journal ends as "
                + "if the daemon had been sent the same quotes (quotes, observations, transitions, spells; no notices).",
                "Every file is checked whole first: a bad file leaves the journal untouched.",
                "Stop the daemon first: an H2 journal in use is refused; a PostgreSQL one cannot be told apart (docs/operations.md)."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:loaded", "1:could not read a file or write the journal", "2:bad input or options (file:line:column: what is wrong)"})
final class BackfillCommand implements Callable<Integer> {

    /** How the journal names quotes a backfill brought, beside the daemon's {@code http}, {@code kafka}, {@code demo}. */
    static final String ORIGIN = "backfill";

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "History CSV files, in any layout replay reads (docs/replay.md): "
            + "loaded in the order given.")
    List<Path> files = new ArrayList<>();

    @Option(names = "--curve", paramLabel = "NAME", description = "Curve name for a one-curve file (default: each file's name without extension).")
    String curve;

    @Mixin
    HistoryReading reading = new HistoryReading();


    @Option(names = "--policy", paramLabel = "FILE", description = "The policy whose 'watch' part the daemon runs "
            + "(default: alert-rules/default.yaml, as the daemon's slopewatch.ingest.policy).")
    Path policy;

    @Option(names = "--journal-url", paramLabel = "JDBC", description = "The journal: jdbc:h2:file:… or jdbc:postgresql://… (default: "
            + "SLOPEWATCH_JOURNAL_URL, else the daemon's H2 file under SLOPEWATCH_DATA_DIR or data/).")
    String journalUrl;

    @Option(names = "--journal-user", paramLabel = "USER", description = "Journal user (default: SLOPEWATCH_JOURNAL_USERNAME).")
    String journalUser;

    @Option(names = "--journal-password-file", paramLabel = "FILE", description = "A file holding the journal password "
            + "(default: SLOPEWATCH_JOURNAL_PASSWORD).")
    Path journalPasswordFile;

    @Option(names = "--step", paramLabel = "N", defaultValue = "" + HistoryBackfill.DEFAULT_STEP,
            description = "Snapshots per transaction (default: ${DEFAULT-VALUE}).")
    int step;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        long started = System.nanoTime();
        Policy parsed;
        List<QuoteMessage> messages = new ArrayList<>();
        long quotes = 0;
        try {
            if (step < 1) {
                throw new IllegalArgumentException("--step " + step + ": a step holds at least one snapshot");
            }
            Path policyFile = policy != null ? policy : Path.of(System.getProperty("slopewatch.home", "."), "alert-rules", "default.yaml");
            parsed = PolicyParser.parse(policyFile.toString(), Files.readAllBytes(policyFile));
            parsed.warnings().forEach(err::println);
            long size = 0;
            for (Path f : files) {
                size += Files.size(f);
            }
            // the whole of every file before the journal is opened: nothing of a file found bad later is committed
            try (ProgressBar bar = ProgressBar.forStderr("backfill: reading", size)) {
                long before = 0;
                for (Path f : files) {
                    HistoryCsvReader.Options options = reading.options(curveName(f));
                    long done = before;
                    try (InputStream raw = Files.newInputStream(f); CountingInputStream in = new CountingInputStream(raw)) {
                        quotes += HistoryCsvReader.read(f.toString(), in, options,
                                snapshot -> messages.add(QuoteMessage.of(snapshot.curve(), snapshot.date(), snapshot.asMap())),
                                () -> bar.update(done + in.count())).quotes();
                    }
                    before += Files.size(f);
                }
            }
        } catch (HistoryFormatException | PolicyException | IllegalArgumentException e) {
            return ReplayFailure.input("backfill", e, err);
        } catch (IOException e) {
            return ReplayFailure.unreadable("backfill", e, err);
        }
        String url = journalUrl();
        String label = JournalLocation.withoutParameters(url);
        try (AgroalDataSource ds = JournalDatabase.open(url, journalUser != null ? journalUser : System.getenv("SLOPEWATCH_JOURNAL_USERNAME"),
                password(), 2)) {
            Clock clock = Clock.systemUTC();
            // no alert stage: history is not news, and notices decided on it would reach the channels from the outbox
            // as the daemon holds memory by default, with checkpoints: the daemon then starts from them, not from every quote
            JournalReader reader = new JournalReader(ds);
            QuotePipeline pipeline = new QuotePipeline(parsed.watches(), new JournalWriter(ds, clock), reader,
                    PipelineListener.NONE, clock, QuotePipeline.Memory.defaults(new CurveCheckpoints(ds, clock)));
            pipeline.recover();
            // run again after it was stopped, or on a file overlapping one loaded before, it loads only what is new or changed
            List<QuoteMessage> toSend;
            try (ProgressBar bar = ProgressBar.forStderr("backfill: checking the journal", messages.size(), "snapshots")) {
                toSend = StandingQuotes.notYetJournalled(messages, reader, bar::update);
            }
            HistoryBackfill.Totals totals;
            try (ProgressBar bar = ProgressBar.forStderr("backfill: journal", toSend.size(), "snapshots")) {
                totals = new HistoryBackfill(pipeline, ORIGIN, step).feed(toSend, bar::update);
            }
            int checkpoints = pipeline.checkpoint(CurveOwnership.ALL);
            out.println(String.format(Locale.ROOT, "backfill: %,d quotes in %,d snapshots from %d file(s) into %s: %,d journalled, "
                    + "%,d skipped (the journal held them already with the same yields), %,d transitions, %,d steps, "
                    + "%,d curve checkpoint(s), %.1f s", quotes, messages.size(), files.size(), label, totals.accepted(),
                    messages.size() - toSend.size(), totals.transitions(), totals.steps(), checkpoints, (System.nanoTime() - started) / 1e9));
            out.flush();
            return 0;
        } catch (JournalException e) {
            err.println("slopewatch backfill: " + (JournalLocation.inUse(e) ? "the journal " + label + " is in use by another process,"
                    + " most likely the daemon: stop it first" : e.getMessage() + ": " + ServeCommand.rootMessage(e).lines().findFirst().orElse("")));
            return 1;
        } catch (IOException e) {
            return ReplayFailure.unreadable("backfill", e, err);
        }
    }

    private String curveName(Path file) {
        if (curve != null) {
            return curve;
        }
        String name = file.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }

    /** The daemon's journal unless told otherwise: the same defaults as {@code slopewatch.journal.url} and {@code slopewatch.data-dir}. */
    private String journalUrl() {
        if (journalUrl != null) {
            return journalUrl;
        }
        String configured = System.getenv("SLOPEWATCH_JOURNAL_URL");
        if (configured != null && !configured.isBlank()) {
            return configured;
        }
        String dataDir = System.getenv("SLOPEWATCH_DATA_DIR");
        Path dir = dataDir != null && !dataDir.isBlank() ? Path.of(dataDir) : Path.of(System.getProperty("slopewatch.home", "."), "data");
        return "jdbc:h2:file:" + dir.toAbsolutePath().normalize().resolve("journal") + ";DB_CLOSE_ON_EXIT=FALSE";
    }

    private String password() throws IOException {
        if (journalPasswordFile == null) {
            return System.getenv("SLOPEWATCH_JOURNAL_PASSWORD");
        }
        // a file written with echo ends with a line break that is no part of the password
        return Files.readString(journalPasswordFile, StandardCharsets.UTF_8).strip();
    }
}
