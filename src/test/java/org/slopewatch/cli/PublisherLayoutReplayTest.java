package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A publisher's file replays to the spreads of the same values written in slopewatch's own CSV:
 * the reader of a layout changes how a file is read, never what the quotes are.
 *
 * <p>Data: monthly U.S. Treasury constant-maturity yields 1953-04 to 1999-09, Federal Reserve H.15
 * via R package tseries data set {@code tcm} (src/test/resources/reference/README.md), in
 * slopewatch's wide layout, and laid out here as each publisher lays out its CSV: the Treasury's
 * par yield curve ({@code Date,"1 Yr",…}, {@code MM/DD/YYYY}, newest first) and the Board's H.15
 * data download (description rows, {@code Time Period} and monthly series identifiers
 * {@code RIFLGFCY01_N.M}…, {@code YYYY-MM} dates), and SDMX-CSV 2.0 sorted by series; the layouts
 * from memory, as documented in {@code HistoryCsvReaderTreasuryTest}, {@code HistoryCsvReaderH15Test}
 * and {@code HistoryCsvReaderSdmxTest}.
 */
class PublisherLayoutReplayTest {

    private static final String[] YEARS = {"1", "3", "5", "10"};

    private static List<String[]> rows;

    @TempDir
    Path dir;

    @BeforeAll
    static void readTheReferenceData() throws Exception {
        List<String> lines = Files.readAllLines(ReferenceReplayTest.resource("reference/us-cmt-monthly-1953-1999.csv"));
        assertThat(lines.get(0)).isEqualTo("date,1Y,3Y,5Y,10Y");
        rows = lines.subList(1, lines.size()).stream().map(l -> l.split(",")).toList();
        assertThat(rows).hasSize(558);
    }

    private static String ownCsv() {
        StringBuilder csv = new StringBuilder("date,1Y,3Y,5Y,10Y\n");
        rows.forEach(r -> csv.append(String.join(",", r)).append('\n'));
        return csv.toString();
    }

    private static String treasuryCsv() {
        StringBuilder csv = new StringBuilder("Date");
        for (String y : YEARS) {
            csv.append(",\"").append(y).append(" Yr\"");
        }
        csv.append("\r\n"); // as a download ends its lines (from memory); any ending is read alike
        List<String[]> newestFirst = new ArrayList<>(rows);
        Collections.reverse(newestFirst);
        for (String[] r : newestFirst) {
            String[] ymd = r[0].split("-");
            csv.append(ymd[1]).append('/').append(ymd[2]).append('/').append(ymd[0]);
            for (int i = 1; i < r.length; i++) {
                csv.append(',').append(r[i]);
            }
            csv.append("\r\n");
        }
        return csv.toString();
    }

    private static String h15Csv() {
        StringBuilder description = new StringBuilder("\"Series Description\"");
        StringBuilder unit = new StringBuilder("\"Unit:\"");
        StringBuilder multiplier = new StringBuilder("\"Multiplier:\"");
        StringBuilder currency = new StringBuilder("\"Currency:\"");
        StringBuilder identifier = new StringBuilder("\"Unique Identifier: \"");
        StringBuilder header = new StringBuilder("\"Time Period\"");
        for (String y : YEARS) {
            String series = "RIFLGFCY" + (y.length() == 1 ? "0" + y : y) + "_N.M";
            description.append(",\"Market yield on U.S. Treasury securities at ").append(y)
                    .append("-year   constant maturity, quoted on investment basis\"");
            unit.append(",\"Percent:_Per_Year\"");
            multiplier.append(",\"1\"");
            currency.append(",\"NA\"");
            identifier.append(",\"H15/H15/").append(series).append('"');
            header.append(",\"").append(series).append('"');
        }
        StringBuilder csv = new StringBuilder();
        for (StringBuilder line : List.of(description, unit, multiplier, currency, identifier, header)) {
            csv.append(line).append('\n');
        }
        for (String[] r : rows) {
            csv.append(r[0], 0, 7); // monthly periods as YYYY-MM
            for (int i = 1; i < r.length; i++) {
                csv.append(',').append(r[i]);
            }
            csv.append('\n');
        }
        return csv.toString();
    }

    /** SDMX-CSV 2.0, sorted by series and then time; the flow and its dimensions invented (the layout: HistoryCsvReaderSdmxTest). */
    private static String sdmxCsv() {
        StringBuilder csv = new StringBuilder("STRUCTURE,STRUCTURE_ID,ACTION,FREQ,REF_AREA,MATURITY,TIME_PERIOD,OBS_VALUE,UNIT_MEASURE\n");
        for (int t = 0; t < YEARS.length; t++) {
            for (String[] r : rows) {
                csv.append("dataflow,DESK:YIELDS(1.0),I,M,XA,Y").append(YEARS[t]).append(',').append(r[0], 0, 7).append(',')
                        .append(r[t + 1]).append(",PC\n");
            }
        }
        return csv.toString();
    }

    /** The replay of a file's text, always from the same path, so that the report's source is the same. */
    private String replay(String csv) throws Exception {
        Path file = dir.resolve("history.csv");
        Files.writeString(file, csv);
        Path map = dir.resolve("series-map.csv");
        Files.writeString(map, "M.XA.Y1,GOVT-A,1Y\nM.XA.Y3,GOVT-A,3Y\nM.XA.Y5,GOVT-A,5Y\nM.XA.Y10,GOVT-A,10Y\n");
        CliRun run = CliRun.of("replay", file.toString(), "--curve", "GOVT-A", "--spread", "10Y-1Y", "--spread", "10Y-3Y",
                "--persistence", "quarter-average", "--recessions", ReferenceReplayTest.resource("reference/us-business-cycle-dates.csv").toString(),
                "--series-map", map.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        return run.out();
    }

    @Test
    void theTreasurysLayoutReplaysToTheSpreadsOfTheSameValuesInSlopewatchsCsv() throws Exception {
        String own = replay(ownCsv());
        assertThat(replay(treasuryCsv())).isEqualTo(own);
        // the report is of the data, not empty: its first and last months and its spreads
        JsonNode report = new ObjectMapper().readTree(own);
        assertThat(report.get("first_date").asText()).isEqualTo("1953-04-01");
        assertThat(report.get("last_date").asText()).isEqualTo("1999-09-01");
        assertThat(report.get("spreads")).extracting(s -> s.get("id").asText()).containsExactly("GOVT-A:10Y-1Y", "GOVT-A:10Y-3Y");
    }

    /** The probit fit of 10Y-1Y on a file's text, from the same path each time. */
    private String fit(String csv) throws Exception {
        Path file = dir.resolve("history.csv");
        Files.writeString(file, csv);
        CliRun run = CliRun.of("fit", file.toString(), "--curve", "GOVT-A", "--spread", "10Y-1Y", "--horizon-months", "12",
                "--recessions", ReferenceReplayTest.resource("reference/us-business-cycle-dates.csv").toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        return run.out();
    }

    @Test
    void fitReadsThePublishersLayoutsAsItReadsSlopewatchsCsv() throws Exception {
        String own = fit(ownCsv());
        assertThat(new ObjectMapper().readTree(own).toString()).contains("10Y-1Y");
        assertThat(fit(treasuryCsv())).isEqualTo(own);
        assertThat(fit(h15Csv())).isEqualTo(own);
    }

    @Test
    void theH15DownloadReplaysToTheSpreadsOfTheSameValuesInSlopewatchsCsv() throws Exception {
        assertThat(replay(h15Csv())).isEqualTo(replay(ownCsv()));
    }

    /** Slopewatch's long layout: one observation a row, as SDMX-CSV has, so that the report's row counts agree too. */
    private static String ownLongCsv() {
        StringBuilder csv = new StringBuilder("date,curve,tenor,yield\n");
        for (String[] r : rows) {
            for (int t = 0; t < YEARS.length; t++) {
                csv.append(r[0]).append(",GOVT-A,").append(YEARS[t]).append("Y,").append(r[t + 1]).append('\n');
            }
        }
        return csv.toString();
    }

    @Test
    void anSdmxCsvFileSortedBySeriesReplaysToTheSpreadsOfTheSameValuesInSlopewatchsCsv() throws Exception {
        String own = replay(ownLongCsv());
        assertThat(replay(sdmxCsv())).isEqualTo(own);
        // and the long file's spreads are the wide file's: only the count of rows tells the layouts apart
        ObjectMapper json = new ObjectMapper();
        assertThat(json.readTree(own).get("spreads")).isEqualTo(json.readTree(replay(ownCsv())).get("spreads"));
        assertThat(json.readTree(own).get("rows").asInt()).isEqualTo(4 * 558);
    }
}
