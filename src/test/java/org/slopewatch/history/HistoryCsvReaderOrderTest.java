package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/**
 * The rows of a long file may come in any order that keeps each curve's dates ascending, the only
 * order the monitors see: by date, by curve and then date (as a database dump sorts them), curves
 * interleaved. What cannot be placed is still refused at its {@code line:column}. Yields in whole
 * basis points, so that the expected values are exact; columns counted by hand beside each case.
 */
class HistoryCsvReaderOrderTest {

    private record Read(List<CurveSnapshot> snapshots, HistoryCsvReader.Summary summary) {
        /** Each curve's snapshots, in the order they were handed on. */
        Map<String, List<String>> perCurve() {
            Map<String, List<String>> out = new TreeMap<>();
            for (CurveSnapshot s : snapshots) {
                out.computeIfAbsent(s.curve(), c -> new ArrayList<>()).add(s.date() + " " + s.asMap());
            }
            return out;
        }
    }

    private static Read read(String csv) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.Summary summary = HistoryCsvReader.read("test.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("unused", YieldUnit.BASIS_POINTS, YieldBounds.DEFAULT), out::add, () -> { });
        return new Read(out, summary);
    }

    private static final String BY_DATE = """
            date,curve,tenor,yield
            2026-01-02,GOVT-A,3M,390
            2026-01-02,GOVT-A,10Y,410
            2026-01-02,GOVT-B,10Y,450
            2026-01-05,GOVT-A,10Y,412
            2026-01-05,GOVT-B,3M,420
            2026-01-05,GOVT-B,10Y,451
            2026-01-05,GOVT-A,3M,391
            2026-01-06,GOVT-B,10Y,452
            2026-01-07,GOVT-A,3M,392
            """;

    /** The same rows sorted by curve and then date, tenors of a date in another order. */
    private static final String BY_CURVE = """
            date,curve,tenor,yield
            2026-01-02,GOVT-A,10Y,410
            2026-01-02,GOVT-A,3M,390
            2026-01-05,GOVT-A,3M,391
            2026-01-05,GOVT-A,10Y,412
            2026-01-07,GOVT-A,3M,392
            2026-01-02,GOVT-B,10Y,450
            2026-01-05,GOVT-B,10Y,451
            2026-01-05,GOVT-B,3M,420
            2026-01-06,GOVT-B,10Y,452
            """;

    @Test
    void aFileSortedByCurveThenDateGivesEachCurveTheSnapshotsOfTheDateSortedFile() throws Exception {
        Read byDate = read(BY_DATE);
        Read byCurve = read(BY_CURVE);
        assertThat(byDate.perCurve()).containsOnlyKeys("GOVT-A", "GOVT-B");
        assertThat(byCurve.perCurve()).isEqualTo(byDate.perCurve());
        assertThat(byCurve.perCurve().get("GOVT-A")).containsExactly(
                "2026-01-02 {3M=390.0, 10Y=410.0}", "2026-01-05 {3M=391.0, 10Y=412.0}", "2026-01-07 {3M=392.0}");
        assertThat(byCurve.summary()).isEqualTo(byDate.summary());
        // the summary's dates are the earliest and the latest of the file, not of its first and last rows
        assertThat(byCurve.summary().first()).isEqualTo(LocalDate.of(2026, 1, 2));
        assertThat(byCurve.summary().last()).isEqualTo(LocalDate.of(2026, 1, 7));
    }

    @Test
    void aCurvesSnapshotIsHandedOnWhenThatCurveMovesToALaterDateAndTheLastOnesAtTheEnd() throws Exception {
        // GOVT-A's 2026-01-02 goes at line 5 (its 2026-01-05), GOVT-B's at line 6, GOVT-B's 2026-01-05 at line 9 (its
        // 2026-01-06), GOVT-A's at line 10; at the end the open ones in the order their first quotes came
        assertThat(read(BY_DATE).snapshots()).extracting(s -> s.curve() + " " + s.date()).containsExactly(
                "GOVT-A 2026-01-02", "GOVT-B 2026-01-02", "GOVT-B 2026-01-05", "GOVT-A 2026-01-05", "GOVT-B 2026-01-06", "GOVT-A 2026-01-07");
    }

    @Test
    void aCurveSortedFileIsHandedOnAsItIsReadNotHeldToItsEnd() throws Exception {
        // GOVT-A's first two dates are complete when its next date comes, before any row of GOVT-B
        assertThat(read(BY_CURVE).snapshots()).extracting(s -> s.curve() + " " + s.date()).startsWith(
                "GOVT-A 2026-01-02", "GOVT-A 2026-01-05");
    }

    @Test
    void curvesInterleavedInAnyWayThatKeepsEachCurvesDatesAscendingAreRead() throws Exception {
        // GOVT-A's rows of 2026-01-02 and of 2026-01-05 are split by rows of later dates of GOVT-B: each curve's own dates ascend
        Read interleaved = read("""
                date,curve,tenor,yield
                2026-01-02,GOVT-B,10Y,450
                2026-01-05,GOVT-B,3M,420
                2026-01-02,GOVT-A,3M,390
                2026-01-05,GOVT-B,10Y,451
                2026-01-02,GOVT-A,10Y,410
                2026-01-05,GOVT-A,10Y,412
                2026-01-06,GOVT-B,10Y,452
                2026-01-05,GOVT-A,3M,391
                2026-01-07,GOVT-A,3M,392
                """);
        assertThat(interleaved.perCurve()).isEqualTo(read(BY_DATE).perCurve());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            // the 3M rows of GOVT-A run through its dates before its 10Y rows start again on the first
            "by curve, tenor, date      | date,curve,tenor,yield\\n2026-01-02,GOVT-A,3M,3.90\\n2026-01-05,GOVT-A,3M,3.91\\n2026-01-02,GOVT-A,10Y,4.10\\n | test.csv:4:1: dates out of order: 2026-01-02 after 2026-01-05",
            "a curve going back         | date,curve,tenor,yield\\n2026-01-05,GOVT-A,3M,3.90\\n2026-01-02,GOVT-B,3M,4.20\\n2026-01-06,GOVT-B,3M,4.21\\n2026-01-02,GOVT-A,3M,3.91\\n | test.csv:5:1: dates out of order: 2026-01-02 after 2026-01-05",
            // "2026-01-05,GOVT-B," is 18 characters: the tenor starts at 19; a second quote is refused however far from the first
            "a duplicate, curve order   | date,curve,tenor,yield\\n2026-01-02,GOVT-A,3M,3.90\\n2026-01-02,GOVT-B,3M,4.20\\n2026-01-05,GOVT-B,3M,4.21\\n2026-01-05,GOVT-B,3m,4.22\\n | test.csv:5:19: second quote for GOVT-B 3M on 2026-01-05",
            "a duplicate, far apart     | date,curve,tenor,yield\\n2026-01-05,GOVT-B,3M,4.21\\n2026-01-02,GOVT-A,3M,3.90\\n2026-01-02,GOVT-A,10Y,4.10\\n2026-01-05,GOVT-B,3M,4.22\\n | test.csv:5:19: second quote for GOVT-B 3M on 2026-01-05",
            "a duplicate, 12M and 1Y    | date,curve,tenor,yield\\n2026-01-05,GOVT-B,12M,4.21\\n2026-01-02,GOVT-A,3M,3.90\\n2026-01-05,GOVT-B,1Y,4.22\\n | test.csv:4:19: second quote for GOVT-B 1Y on 2026-01-05",
            "a missing value going back | date,curve,tenor,yield\\n2026-01-05,GOVT-A,3M,3.90\\n2026-01-02,GOVT-A,3M,NA\\n | test.csv:3:1: dates out of order: 2026-01-02 after 2026-01-05",
    })
    void whatCannotBePlacedIsRefusedAtItsLineAndColumn(String name, String text, String expected) {
        // read as the replay reads a file: percent
        assertThat(HistoryCsvReaderFormatTest.refusal(text.replace("\\n", "\n").getBytes(StandardCharsets.UTF_8))).startsWith(expected);
    }
}
