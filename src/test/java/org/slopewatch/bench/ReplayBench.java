package org.slopewatch.bench;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.Watch;
import org.slopewatch.replay.Replay;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.replay.SpreadReport;
import org.slopewatch.spread.SpreadDefinition;

/**
 * Quotes per second of a full replay ({@link Replay#run}, spread 10Y-3M, quarter-average test at
 * 0 bp: what {@code ./slopewatch replay FILE --spread 10Y-3M} runs) against parsing the same file
 * and doing nothing else ({@link HistoryCsvReader#read} with a sink that ignores the snapshots).
 *
 * <p>One JVM, a few warm-up rounds, then measured rounds. Each round runs both, in alternating
 * order, so that a noisy neighbour slows both rather than one. Both read the file through
 * {@link Files#newInputStream} as the launcher does; after the first round it sits in the page cache.
 *
 * <p>Usage: {@code ReplayBench FILE RESULTS [WARMUP_ROUNDS [ROUNDS]]}. Not a test (surefire
 * excludes bench/).
 */
public final class ReplayBench {

    private ReplayBench() {
    }

    public static void main(String[] args) throws IOException, HistoryFormatException {
        if (args.length < 2) {
            System.err.println("usage: ReplayBench FILE RESULTS [WARMUP_ROUNDS [ROUNDS]]");
            System.exit(2);
        }
        Path file = Path.of(args[0]);
        Path results = Path.of(args[1]);
        int warmups = args.length > 2 ? Integer.parseInt(args[2]) : 5;
        int rounds = args.length > 3 ? Integer.parseInt(args[3]) : 10;
        String curve = curveName(file);
        HistoryCsvReader.Options options = new HistoryCsvReader.Options(curve, YieldUnit.PERCENT, YieldBounds.DEFAULT);
        List<Watch> watches = List.of(new Watch(SpreadDefinition.parse("10Y-3M"), MonitorDefinition.quarterAverageAtZero(), Set.of()));

        double[] parseRates = new double[rounds];
        double[] replayRates = new double[rounds];
        long quotes = -1;
        ReplayReport last = null;
        for (int round = -warmups; round < rounds; round++) {
            long parseNanos = 0;
            long replayNanos = 0;
            for (int k = 0; k < 2; k++) {
                boolean parseNow = (k == 0) == (Math.floorMod(round, 2) == 0);
                long start = System.nanoTime();
                if (parseNow) {
                    HistoryCsvReader.Summary s = parseOnly(file, options);
                    parseNanos = System.nanoTime() - start;
                    quotes = check(quotes, s.quotes(), "parse-only");
                } else {
                    last = replay(file, options, watches);
                    replayNanos = System.nanoTime() - start;
                    quotes = check(quotes, last.quotes(), "replay");
                }
            }
            double parseRate = quotes / (parseNanos / 1e9);
            double replayRate = quotes / (replayNanos / 1e9);
            System.out.printf(Locale.ROOT, "%s %2d  parse-only %,14.0f quotes/s  replay %,14.0f quotes/s  ratio %.3f%n",
                    round < 0 ? "warm-up" : "round  ", round < 0 ? round + warmups + 1 : round + 1, parseRate, replayRate,
                    replayRate / parseRate);
            if (round >= 0) {
                parseRates[round] = parseRate;
                replayRates[round] = replayRate;
            }
        }

        SpreadReport spread = last.spreads().get(0);
        List<String> lines = new ArrayList<>();
        lines.add("replay.file=" + file);
        lines.add("replay.bytes=" + Files.size(file));
        lines.add("replay.rows=" + last.rows());
        lines.add("replay.quotes=" + last.quotes());
        lines.add("replay.first=" + last.firstDate());
        lines.add("replay.last=" + last.lastDate());
        lines.add("replay.quarters=" + spread.quarters().size());
        lines.add("replay.transitions=" + spread.transitions().size());
        lines.add("replay.spells=" + spread.spells().size());
        lines.add("replay.warmups=" + warmups);
        lines.add("replay.rounds=" + rounds);
        describe(lines, "parse", parseRates);
        describe(lines, "replay", replayRates);
        double[] ratios = new double[rounds];
        for (int i = 0; i < rounds; i++) {
            ratios[i] = replayRates[i] / parseRates[i];
        }
        lines.add("ratio.median_of_medians=" + String.format(Locale.ROOT, "%.3f", median(replayRates) / median(parseRates)));
        lines.add("ratio.per_round_min=" + String.format(Locale.ROOT, "%.3f", Arrays.stream(ratios).min().orElseThrow()));
        lines.add("ratio.per_round_max=" + String.format(Locale.ROOT, "%.3f", Arrays.stream(ratios).max().orElseThrow()));
        Files.createDirectories(results.toAbsolutePath().getParent());
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(results, StandardCharsets.UTF_8))) {
            lines.forEach(w::println);
        }
    }

    static HistoryCsvReader.Summary parseOnly(Path file, HistoryCsvReader.Options options) throws IOException, HistoryFormatException {
        try (InputStream in = Files.newInputStream(file)) {
            return HistoryCsvReader.read(file.toString(), in, options, snapshot -> { }, () -> { });
        }
    }

    static ReplayReport replay(Path file, HistoryCsvReader.Options options, List<Watch> watches)
            throws IOException, HistoryFormatException {
        try (InputStream in = Files.newInputStream(file)) {
            return new Replay(watches).run(file.toString(), in, options, null, () -> { });
        }
    }

    private static long check(long expected, long quotes, String what) {
        if (expected >= 0 && expected != quotes) {
            throw new IllegalStateException(what + " read " + quotes + " quotes, the other read " + expected);
        }
        return quotes;
    }

    private static void describe(List<String> lines, String key, double[] rates) {
        double mean = Arrays.stream(rates).average().orElseThrow();
        double var = Arrays.stream(rates).map(r -> (r - mean) * (r - mean)).sum() / Math.max(1, rates.length - 1);
        lines.add(key + ".median=" + whole(median(rates)));
        lines.add(key + ".min=" + whole(Arrays.stream(rates).min().orElseThrow()));
        lines.add(key + ".max=" + whole(Arrays.stream(rates).max().orElseThrow()));
        lines.add(key + ".mean=" + whole(mean));
        lines.add(key + ".sd=" + whole(Math.sqrt(var)));
        lines.add(key + ".all=" + String.join(" ", Arrays.stream(rates).mapToObj(ReplayBench::whole).toList()));
    }

    static double median(double[] values) {
        double[] s = values.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
    }

    private static String whole(double v) {
        return String.format(Locale.ROOT, "%.0f", v);
    }

    /** As the launcher names a wide file's curve: the file name without its extension. */
    private static String curveName(Path file) {
        String name = file.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }
}
