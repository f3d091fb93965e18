package org.slopewatch.bench;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.HistoryBackfill;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * Builds a journal for the scale benchmark the way {@code slopewatch backfill} writes one: the
 * {@link QuotePipeline} with the daemon's {@link JournalWriter} on an H2 file at {@code DIR/journal}
 * (the URL the daemon opens for {@code slopewatch.data-dir=DIR}), fed by {@link HistoryBackfill} day
 * by day, every curve each day, in steps of many messages, checkpoints at the end. The curves are
 * generated rather than read from a file: at full scale a file would be gigabytes, which the command
 * holds in memory whole. Also writes the policy to {@code DIR/scale-policy.yaml}.
 * With 0 curves it only creates the empty, migrated journal that the baseline starts on.
 *
 * <p>Arguments: DIR CURVES YEARS [MESSAGES_PER_STEP]. Not a test (surefire excludes bench/).
 * With {@code -Dscale.journal-url=jdbc:postgresql://…} (user and password {@code sw}, as
 * {@code .ci/postgres.sh} creates them; the database must exist and be empty) the journal is built
 * there instead, and the URL is written to {@code DIR/journal-url.txt}, where
 * {@link ScaleStartupBench} finds it.
 */
public final class ScaleJournalBuilder {

    /** The pipeline logs every transition at INFO, as the daemon does; thousands of lines would only slow the build. */
    private static final java.util.logging.Logger TRANSITIONS = java.util.logging.Logger.getLogger("org.slopewatch.transitions");

    static {
        TRANSITIONS.setLevel(java.util.logging.Level.WARNING);
    }

    /** Whether the journal gets checkpoints at the end ({@code -Dscale.checkpoints=false}: a journal as written before they existed). */
    private static final boolean CHECKPOINTS = Boolean.parseBoolean(System.getProperty("scale.checkpoints", "true"));

    public static void main(String[] args) throws Exception {
        Path dir = Path.of(args[0]).toAbsolutePath();
        int curves = Integer.parseInt(args[1]);
        double years = Double.parseDouble(args[2]);
        int perStep = args.length > 3 ? Integer.parseInt(args[3]) : 2_000;
        Files.createDirectories(dir);
        Files.writeString(dir.resolve("scale-policy.yaml"), ScaleScenario.policyYaml());
        String postgres = System.getProperty("scale.journal-url");
        String url = postgres != null ? postgres : "jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_ON_EXIT=FALSE";
        if (postgres != null) {
            Files.writeString(dir.resolve(ScaleStartupBench.JOURNAL_URL_FILE), postgres);
        }
        long t0 = System.nanoTime();
        long messages = 0;
        long postgresBytes;
        List<LocalDate> days = curves == 0 ? List.of() : ScaleScenario.businessDays(years);
        try (AgroalDataSource ds = JournalDatabase.open(url, postgres != null ? "sw" : null, postgres != null ? "sw" : null, 4)) {
            // as the daemon runs by default: 400 days held in memory, checkpoints written at the end (as at its shutdown)
            QuotePipeline pipeline = new QuotePipeline(ScaleScenario.watches(), new JournalWriter(ds, Clock.systemUTC()),
                    new JournalReader(ds), PipelineListener.NONE, org.slopewatch.alerting.AlertStage.NONE, Clock.systemUTC(),
                    QuotePipeline.Memory.defaults(new org.slopewatch.journal.CurveCheckpoints(ds, Clock.systemUTC())));
            pipeline.recover();
            ScaleScenario.CurveWalk[] walks = ScaleScenario.walks(curves);
            List<QuoteMessage> step = new ArrayList<>(perStep);
            for (LocalDate day : days) {
                for (ScaleScenario.CurveWalk walk : walks) {
                    step.add(walk.next(day));
                    if (step.size() == perStep) {
                        messages += process(pipeline, step);
                    }
                }
            }
            messages += process(pipeline, step);
            if (CHECKPOINTS) {
                pipeline.checkpoint(org.slopewatch.pipeline.CurveOwnership.ALL);
            }
            postgresBytes = postgres != null ? postgresBytes(ds) : 0;
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        long bytes = postgres != null ? postgresBytes : h2Bytes(dir);
        String line = String.format(Locale.ROOT, "scale-journal dir=%s curves=%d spreads=%d years=%s business_days=%d first=%s messages=%d "
                        + "observation_rows=%d seconds=%.1f messages_per_s=%.0f journal_bytes=%d",
                dir.getFileName(), curves, curves * ScaleScenario.SPREADS.length, args[2], days.size(), days.isEmpty() ? "-" : days.get(0),
                messages, messages * ScaleScenario.SPREADS.length, seconds, messages / seconds, bytes);
        // written last: a journal without it was interrupted and is built again
        Files.writeString(dir.resolve("built.txt"), line + System.lineSeparator());
        System.out.println(line);
    }

    /** One step through the backfill command's own loop ({@link HistoryBackfill}), as one transaction. */
    private static int process(QuotePipeline pipeline, List<QuoteMessage> step) {
        if (step.isEmpty()) {
            return 0;
        }
        HistoryBackfill.Totals totals = new HistoryBackfill(pipeline, "backfill", step.size()).feed(step, done -> { });
        if (totals.accepted() != step.size() || totals.steps() != 1) {
            throw new IllegalStateException("accepted " + totals.accepted() + " of " + step.size() + " in " + totals.steps() + " step(s)");
        }
        int n = step.size();
        step.clear();
        return n;
    }

    private static long h2Bytes(Path dir) throws java.io.IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.filter(p -> p.getFileName().toString().startsWith("journal")).mapToLong(p -> p.toFile().length()).sum();
        }
    }

    /** The database's size on disk, as PostgreSQL counts it ({@code pg_database_size}). */
    private static long postgresBytes(AgroalDataSource ds) throws java.sql.SQLException {
        try (var c = ds.getConnection(); var rs = c.createStatement().executeQuery("SELECT pg_database_size(current_database())")) {
            rs.next();
            return rs.getLong(1);
        }
    }
}
