package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.testsupport.JournalContents;

/**
 * {@code slopewatch backfill} on real data: the Federal Reserve's H.15 monthly constant-maturity
 * yields, April 1953 to September 1999, 558 months of 1Y, 3Y, 5Y and 10Y (provenance in
 * {@code src/test/resources/reference/README.md}), into an H2 journal. The reference is the
 * daemon's path: the same file's snapshots through a pipeline one step per snapshot, as the
 * daemon takes a CSV body per request.
 */
class BackfillCommandTest {

    private static final Path H15 = Path.of("src/test/resources/reference/us-cmt-monthly-1953-1999.csv");
    private static final Path POLICY = Path.of("src/test/resources/policies/reference-report.yaml");
    private static final String QUOTES = "SELECT seq, message_id, origin, curve, market_date, yields FROM quote ORDER BY seq";

    @TempDir
    Path dir;

    @Test
    void aBackfillJournalsWhatTheDaemonJournalsForTheSameQuotesAndADaemonRecoversTheSameStates() throws Exception {
        String backfilled = "jdbc:h2:file:" + dir.resolve("backfilled");
        CliRun run = CliRun.of("backfill", H15.toString(), "--curve", "US", "--policy", POLICY.toString(), "--journal-url", backfilled,
                "--journal-user", "sa", "--step", "100");

        assertThat(run.exitCode()).as(run.err()).isZero();
        // 558 months of four tenors (the README's count of the H.15 file)
        assertThat(run.out()).matches("(?s)backfill: 2,232 quotes in 558 snapshots from 1 file\\(s\\) into jdbc:h2:file:\\S+: "
                + "558 journalled, 0 skipped \\(the journal held them already with the same yields\\), "
                + "\\d+ transitions, 6 steps, 1 curve checkpoint\\(s\\), \\d+\\.\\d s\\R");

        String oneByOne = "jdbc:h2:file:" + dir.resolve("one-by-one");
        QuotePipeline daemon;
        try (AgroalDataSource ds = JournalDatabase.open(oneByOne, "sa", "", 2)) {
            daemon = pipeline(ds);
            for (QuoteMessage m : snapshots(H15)) {
                daemon.process(List.of(new QuoteBatch(BackfillCommand.ORIGIN, List.of(m), List.of())));
            }
            try (AgroalDataSource again = JournalDatabase.open(backfilled, "sa", "", 2)) {
                assertThat(pipeline(again).spreads()).as("states a daemon recovers from the backfilled journal")
                        .isEqualTo(daemon.spreads());
                Clock clock = Clock.systemUTC();
                QuotePipeline fromCheckpoints = new QuotePipeline(PolicyParser.parse(POLICY.toString(), Files.readAllBytes(POLICY)).watches(),
                        new JournalWriter(again, clock), new JournalReader(again), PipelineListener.NONE, clock,
                        QuotePipeline.Memory.defaults(new org.slopewatch.journal.CurveCheckpoints(again, clock)));
                assertThat(fromCheckpoints.recover()).as("quotes a daemon replays after the backfill's checkpoints").isZero();
                assertThat(fromCheckpoints.spreads()).as("states a daemon starts with from them").isEqualTo(daemon.spreads());
            }
        }
        assertThat(rows(backfilled, QUOTES)).as("quotes").hasSize(558).isEqualTo(rows(oneByOne, QUOTES));
        JournalContents expected = JournalContents.read(oneByOne, "sa", "");
        JournalContents actual = JournalContents.read(backfilled, "sa", "");
        assertThat(actual.transitions()).as("transitions (the 10Y-1Y inversions of 1966-2000)").isNotEmpty()
                .isEqualTo(expected.transitions());
        assertThat(actual.spells()).as("spells").isNotEmpty().isEqualTo(expected.spells());
        assertThat(run.out()).contains(" " + actual.transitions().size() + " transitions");
    }

    @Test
    void aBadFileAmongSeveralLeavesTheJournalAsItWas() throws Exception {
        List<String> lines = Files.readAllLines(H15);
        Path first = Files.write(dir.resolve("first.csv"), lines.subList(0, 300));
        List<String> rest = new ArrayList<>(lines.subList(300, lines.size()));
        rest.add(0, lines.get(0));
        Path second = Files.write(dir.resolve("second.csv"), rest);
        List<String> broken = new ArrayList<>(rest);
        broken.set(3, broken.get(3).replaceFirst(",[^,]*$", ",4.1x"));
        Path bad = Files.write(dir.resolve("bad.csv"), broken);
        String url = "jdbc:h2:file:" + dir.resolve("journal");
        String[] common = {"--curve", "US", "--policy", POLICY.toString(), "--journal-url", url, "--journal-user", "sa", "--step", "7"};

        assertThat(CliRun.of(concat(new String[] {"backfill", first.toString()}, common)).exitCode()).isZero();
        List<String> quotesBefore = rows(url, QUOTES);
        JournalContents before = JournalContents.read(url, "sa", "");

        // the good file comes first and is read whole; the bad one after it must stop everything
        CliRun refused = CliRun.of(concat(new String[] {"backfill", second.toString(), bad.toString()}, common));

        assertThat(refused.exitCode()).as(refused.out() + refused.err()).isEqualTo(2);
        assertThat(refused.err()).as("where the problem is, as replay gives it").matches("(?s)\\S*bad\\.csv:4:\\d+: .*");
        assertThat(refused.out()).isEmpty();
        assertThat(rows(url, QUOTES)).as("quotes after the refused run").hasSize(299).isEqualTo(quotesBefore);
        assertThat(JournalContents.read(url, "sa", "")).isEqualTo(before);

        CliRun fixed = CliRun.of(concat(new String[] {"backfill", second.toString()}, common));
        assertThat(fixed.exitCode()).as(fixed.err()).isZero();
        assertThat(rows(url, QUOTES)).as("both halves, once each").hasSize(558);
    }

    /**
     * A backfill stopped midway left its first steps committed; the same command run again loads the
     * rest, and the journal is the one a single run writes. Run once more, it loads nothing; a file
     * with one month's yields changed loads that month alone, as a revision.
     */
    @Test
    void aBackfillRunAgainLoadsOnlyWhatTheJournalDoesNotHoldAsItStands() throws Exception {
        List<String> lines = Files.readAllLines(H15);
        Path firstSteps = Files.write(dir.resolve("first-steps.csv"), lines.subList(0, 300));
        String url = "jdbc:h2:file:" + dir.resolve("journal");
        String whole = "jdbc:h2:file:" + dir.resolve("whole");
        String[] common = {"--curve", "US", "--policy", POLICY.toString(), "--journal-user", "sa", "--step", "50"};

        assertThat(CliRun.of(concat(new String[] {"backfill", H15.toString(), "--journal-url", whole}, common)).exitCode()).isZero();
        assertThat(CliRun.of(concat(new String[] {"backfill", firstSteps.toString(), "--journal-url", url}, common)).exitCode()).isZero();

        CliRun again = CliRun.of(concat(new String[] {"backfill", H15.toString(), "--journal-url", url}, common));

        assertThat(again.exitCode()).as(again.err()).isZero();
        assertThat(again.out()).contains(": 259 journalled, 299 skipped (the journal held them already with the same yields), ");
        assertThat(rows(url, QUOTES)).as("quotes, each once, numbered as one run numbers them").hasSize(558).isEqualTo(rows(whole, QUOTES));
        JournalContents once = JournalContents.read(whole, "sa", "");
        assertThat(once.transitions()).isNotEmpty();
        assertThat(JournalContents.read(url, "sa", "")).as("the journal of one run").isEqualTo(once);

        CliRun thirdTime = CliRun.of(concat(new String[] {"backfill", H15.toString(), "--journal-url", url}, common));

        assertThat(thirdTime.exitCode()).as(thirdTime.err()).isZero();
        assertThat(thirdTime.out()).contains(": 0 journalled, 558 skipped (");
        assertThat(rows(url, QUOTES)).hasSize(558);
        assertThat(JournalContents.read(url, "sa", "")).isEqualTo(once);

        // one month's 10Y a point higher: that month goes in, as the daemon takes a revised quote
        List<String> revised = new ArrayList<>(lines);
        String[] month = revised.get(120).split(",");
        month[month.length - 1] = Double.toString(Double.parseDouble(month[month.length - 1]) + 1);
        revised.set(120, String.join(",", month));
        Path revisedFile = Files.write(dir.resolve("revised.csv"), revised);

        CliRun revision = CliRun.of(concat(new String[] {"backfill", revisedFile.toString(), "--journal-url", url}, common));

        assertThat(revision.exitCode()).as(revision.err()).isZero();
        assertThat(revision.out()).contains(": 1 journalled, 557 skipped (");
        List<String> quotes = rows(url, QUOTES);
        assertThat(quotes).hasSize(559);
        assertThat(quotes.get(558)).as("the revised month, last").contains(month[0]);
    }

    private static QuotePipeline pipeline(AgroalDataSource ds) throws Exception {
        Clock clock = Clock.systemUTC();
        QuotePipeline p = new QuotePipeline(PolicyParser.parse(POLICY.toString(), Files.readAllBytes(POLICY)).watches(),
                new JournalWriter(ds, clock), new JournalReader(ds), PipelineListener.NONE, AlertStage.NONE, clock);
        p.recover();
        return p;
    }

    private static List<QuoteMessage> snapshots(Path file) throws Exception {
        List<QuoteMessage> out = new ArrayList<>();
        try (InputStream in = Files.newInputStream(file)) {
            HistoryCsvReader.read(file.toString(), in, new HistoryCsvReader.Options("US", YieldUnit.PERCENT, YieldBounds.DEFAULT),
                    s -> out.add(QuoteMessage.of(s.curve(), s.date(), s.asMap())), () -> { });
        }
        return out;
    }

    private static List<String> rows(String url, String query) throws Exception {
        List<String> out = new ArrayList<>();
        try (Connection c = DriverManager.getConnection(url, "sa", ""); Statement s = c.createStatement(); ResultSet rs = s.executeQuery(query)) {
            int columns = rs.getMetaData().getColumnCount();
            while (rs.next()) {
                StringBuilder row = new StringBuilder();
                for (int i = 1; i <= columns; i++) {
                    row.append(i == 1 ? "" : " | ").append(rs.getString(i));
                }
                out.add(row.toString());
            }
        }
        return out;
    }

    private static String[] concat(String[] a, String[] b) {
        String[] out = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }
}
