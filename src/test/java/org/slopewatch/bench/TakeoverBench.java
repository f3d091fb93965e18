package org.slopewatch.bench;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.CurveOwnership;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * Takeover time against the number of curves moved, in one JVM on one H2 journal: instance A
 * journals the scenario's history for every curve with checkpoints (as its shutdown writes them),
 * instance B starts on the same journal; then A takes one more day's quote for the first K curves
 * and B takes those curves over ({@link QuotePipeline#takeOver}), timed, for growing K. The
 * baselines, timed in the same run on the same journal: B's start from the checkpoints, and a start
 * that reads none and replays every quote (what every assignment cost before takeovers rebuilt
 * only the curves that moved).
 *
 * <p>Arguments: DIR CURVES YEARS K... (K ascending, at most CURVES). Not a test (surefire excludes bench/).
 */
public final class TakeoverBench {

    public static void main(String[] args) throws Exception {
        Path dir = Path.of(args[0]).toAbsolutePath();
        int curves = Integer.parseInt(args[1]);
        double years = Double.parseDouble(args[2]);
        List<Integer> moves = new ArrayList<>();
        for (int i = 3; i < args.length; i++) {
            moves.add(Integer.parseInt(args[i]));
        }
        Files.createDirectories(dir);
        Clock clock = Clock.systemUTC();
        String url = "jdbc:h2:file:" + dir.resolve("journal-" + System.nanoTime()) + ";DB_CLOSE_ON_EXIT=FALSE";
        try (AgroalDataSource ds = JournalDatabase.open(url, null, null, 4)) {
            QuotePipeline a = pipeline(ds, clock, true);
            List<LocalDate> days = ScaleScenario.businessDays(years);
            ScaleScenario.CurveWalk[] walks = ScaleScenario.walks(curves);
            long t0 = System.nanoTime();
            List<QuoteMessage> step = new ArrayList<>();
            for (LocalDate day : days) {
                for (ScaleScenario.CurveWalk walk : walks) {
                    step.add(walk.next(day));
                    if (step.size() == 2_000) {
                        a.process(List.of(new QuoteBatch("bench", List.copyOf(step), List.of())));
                        step.clear();
                    }
                }
            }
            if (!step.isEmpty()) {
                a.process(List.of(new QuoteBatch("bench", List.copyOf(step), List.of())));
            }
            a.checkpoint(CurveOwnership.ALL);
            System.out.printf(Locale.ROOT, "takeover-journal curves=%d years=%s messages=%d build_s=%.1f%n", curves, args[2],
                    (long) days.size() * curves, (System.nanoTime() - t0) / 1e9);

            long t1 = System.nanoTime();
            QuotePipeline whole = pipeline(ds, clock, false);
            double wholeSeconds = (System.nanoTime() - t1) / 1e9;
            long t2 = System.nanoTime();
            QuotePipeline b = pipeline(ds, clock, true);
            double startSeconds = (System.nanoTime() - t2) / 1e9;
            System.out.printf(Locale.ROOT, "takeover-baseline start_from_checkpoints_s=%.3f start_replaying_every_quote_s=%.3f%n",
                    startSeconds, wholeSeconds);
            whole.spreads(); // kept reachable until measured

            LocalDate next = days.get(days.size() - 1);
            // the first takeover pays for compiling its path: once, unreported
            moves.add(0, moves.get(0));
            boolean warmUp = true;
            for (int k : moves) {
                next = next.plusDays(1);
                List<QuoteMessage> day = new ArrayList<>();
                for (int i = 0; i < k; i++) {
                    day.add(walks[i].next(next));
                }
                a.process(List.of(new QuoteBatch("bench", day, List.of())));
                long t = System.nanoTime();
                Set<String> moved = b.takeOver(CurveOwnership.ALL);
                double seconds = (System.nanoTime() - t) / 1e9;
                if (moved.size() != k) {
                    throw new IllegalStateException("expected " + k + " curves moved, got " + moved.size());
                }
                if (warmUp) {
                    warmUp = false;
                    continue;
                }
                System.out.printf(Locale.ROOT, "takeover curves=%d moved=%d seconds=%.3f of_start_from_checkpoints=%.3f "
                                + "of_start_replaying_every_quote=%.4f%n", curves, k, seconds, seconds / startSeconds, seconds / wholeSeconds);
            }
        }
    }

    private static QuotePipeline pipeline(AgroalDataSource ds, Clock clock, boolean checkpoints) {
        QuotePipeline p = new QuotePipeline(ScaleScenario.watches(), new JournalWriter(ds, clock), new JournalReader(ds),
                PipelineListener.NONE, clock, QuotePipeline.Memory.defaults(checkpoints ? new CurveCheckpoints(ds, clock) : null));
        p.recover();
        return p;
    }
}
