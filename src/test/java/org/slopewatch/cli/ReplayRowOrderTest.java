package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A long history file gives the same replay, to the byte, whatever the order of its rows, as long
 * as each curve's dates ascend: sorted by date, sorted by curve and then date as a database dump
 * writes it, or shuffled with each curve's rows kept in their order.
 *
 * <p>Data: monthly U.S. Treasury constant-maturity yields 1953-04 to 1999-09, Federal Reserve H.15
 * via R package tseries data set {@code tcm} (src/test/resources/reference/README.md), laid out by
 * the test as three curves that start and end apart and whose names do not follow their starts:
 * GOVT-C the whole file, GOVT-A from 1960, GOVT-B up to 1990. Recession dates: NBER business-cycle
 * reference dates (from memory). The orders are made here, shuffles with fixed seeds.
 */
class ReplayRowOrderTest {

    private static final String[] TENORS = {"1Y", "3Y", "5Y", "10Y"};

    /** One row of the long layout. */
    private record Row(String date, String curve, String tenor, String yield) {
        String line() {
            return date + "," + curve + "," + tenor + "," + yield + "\n";
        }
    }

    private static List<Row> byDate;
    private static Path recessions;

    @TempDir
    Path dir;

    @BeforeAll
    static void layOutTheReferenceData() throws Exception {
        recessions = ReferenceReplayTest.resource("reference/us-business-cycle-dates.csv");
        List<String> lines = Files.readAllLines(ReferenceReplayTest.resource("reference/us-cmt-monthly-1953-1999.csv"));
        assertThat(lines.get(0)).isEqualTo("date,1Y,3Y,5Y,10Y");
        byDate = new ArrayList<>();
        for (String line : lines.subList(1, lines.size())) {
            String[] cells = line.split(",");
            String date = cells[0];
            // within each date the curves in an order that is neither their names' nor their starts'
            for (String curve : List.of("GOVT-B", "GOVT-C", "GOVT-A")) {
                boolean quoted = switch (curve) {
                    case "GOVT-A" -> date.compareTo("1960-01-01") >= 0;
                    case "GOVT-B" -> date.compareTo("1990-12-01") <= 0;
                    default -> true;
                };
                for (int t = 0; quoted && t < TENORS.length; t++) {
                    byDate.add(new Row(date, curve, TENORS[t], cells[t + 1]));
                }
            }
        }
        assertThat(byDate).hasSize(4 * (558 + (558 - 81) + (558 - 105)));
    }

    /** Sorted by curve and then date, the tenors of each curve's date shuffled. */
    private static List<Row> byCurveThenDate(long seed) {
        Map<String, List<Row>> blocks = new LinkedHashMap<>();
        for (Row r : byDate) {
            blocks.computeIfAbsent(r.curve() + "," + r.date(), k -> new ArrayList<>()).add(r);
        }
        List<String> keys = new ArrayList<>(blocks.keySet());
        keys.sort(Comparator.naturalOrder()); // curve, then the ISO date
        Random random = new Random(seed);
        List<Row> out = new ArrayList<>();
        for (String key : keys) {
            List<Row> block = new ArrayList<>(blocks.get(key));
            Collections.shuffle(block, random);
            out.addAll(block);
        }
        return out;
    }

    /** Every row shuffled, except that each curve's rows keep their order: the curves' streams merged at random. */
    private static List<Row> shuffledKeepingEachCurvesOrder(long seed) {
        Map<String, List<Row>> streams = new LinkedHashMap<>();
        for (Row r : byDate) {
            streams.computeIfAbsent(r.curve(), k -> new ArrayList<>()).add(r);
        }
        List<String> picks = new ArrayList<>();
        streams.forEach((curve, rows) -> picks.addAll(Collections.nCopies(rows.size(), curve)));
        Collections.shuffle(picks, new Random(seed));
        Map<String, Integer> next = new LinkedHashMap<>();
        List<Row> out = new ArrayList<>();
        for (String curve : picks) {
            int i = next.merge(curve, 1, Integer::sum) - 1;
            out.add(streams.get(curve).get(i));
        }
        return out;
    }

    /** The replay of the rows, always from the same path, so that the report's source is the same. */
    private CliRun replay(List<Row> rows, String... format) throws IOException {
        StringBuilder csv = new StringBuilder("date,curve,tenor,yield\n");
        rows.forEach(r -> csv.append(r.line()));
        Path file = dir.resolve("history.csv");
        Files.writeString(file, csv);
        List<String> args = new ArrayList<>(List.of("replay", file.toString(), "--spread", "10Y-1Y", "--spread", "10Y-3Y",
                "--persistence", "quarter-average", "--recessions", recessions.toString()));
        args.addAll(List.of(format));
        CliRun run = CliRun.of(args.toArray(String[]::new));
        assertThat(run.exitCode()).as(run.err()).isZero();
        return run;
    }

    @Test
    void aFileSortedByCurveThenDateReplaysToTheBytesOfTheDateSortedFile() throws IOException {
        List<Row> byCurve = byCurveThenDate(20260105L);
        assertThat(byCurve).isNotEqualTo(byDate).containsExactlyInAnyOrderElementsOf(byDate);
        assertThat(replay(byCurve, "--json").out()).isEqualTo(replay(byDate, "--json").out());
        assertThat(replay(byCurve, "--transitions").out()).isEqualTo(replay(byDate, "--transitions").out());
    }

    @Test
    void rowsShuffledWithEachCurvesOrderKeptReplayToTheSameBytes() throws IOException {
        String expected = replay(byDate, "--json").out();
        for (long seed : new long[] {1L, 2L, 3L}) {
            List<Row> shuffled = shuffledKeepingEachCurvesOrder(seed);
            assertThat(shuffled).isNotEqualTo(byDate).containsExactlyInAnyOrderElementsOf(byDate);
            assertThat(replay(shuffled, "--json").out()).as("shuffle with seed %d", seed).isEqualTo(expected);
        }
    }

    @Test
    void theReportOfACurveSortedFileStatesTheFactsOfTheData() throws IOException {
        JsonNode report = new ObjectMapper().readTree(replay(byCurveThenDate(7L), "--json").out());
        // the file's dates are its earliest and latest, whichever rows hold them
        assertThat(report.get("first_date").asText()).isEqualTo("1953-04-01");
        assertThat(report.get("last_date").asText()).isEqualTo("1999-09-01");
        assertThat(report.get("spreads")).extracting(s -> s.get("id").asText()).containsExactly(
                "GOVT-A:10Y-1Y", "GOVT-A:10Y-3Y", "GOVT-B:10Y-1Y", "GOVT-B:10Y-3Y", "GOVT-C:10Y-1Y", "GOVT-C:10Y-3Y");
        List<String> negative = new ArrayList<>();
        for (JsonNode spread : report.get("spreads")) {
            if (spread.get("id").asText().equals("GOVT-C:10Y-1Y")) {
                for (JsonNode q : spread.get("quarters")) {
                    if (q.get("average_bp").asDouble() < 0) {
                        negative.add(q.get("quarter").asText());
                    }
                }
            }
        }
        // Stated with the data (reference/README.md): quarters averaging below zero start runs in 1957Q3, 1959Q3, 1966Q1,
        // 1968Q2, 1973Q2, 1978Q4, 1980Q4, 1989Q1, and (the README's note, worked from the file's rows) 1982Q1.
        assertThat(ReplayText.runStarts(negative.stream()
                .map(q -> new org.slopewatch.replay.SpreadReport.QuarterRow(q, -1, 1)).toList()))
                .containsExactly("1957Q3", "1959Q3", "1966Q1", "1968Q2", "1973Q2", "1978Q4", "1980Q4", "1982Q1", "1989Q1");
    }
}
