package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/**
 * SDMX-CSV, read as the SDMX technical standards lay it out (from memory of the SDMX-CSV format
 * documents, versions 1.0 and 2.0): a header row; in 1.0 a first column {@code DATAFLOW} holding the
 * flow's reference ({@code AGENCY:ID(VERSION)}), in 2.0 the columns {@code STRUCTURE} (e.g.
 * {@code dataflow}), {@code STRUCTURE_ID} and {@code ACTION} ({@code I} information, {@code A}
 * append, {@code R} replace, {@code D} delete); then one column per dimension in the structure's
 * order, {@code TIME_PERIOD}, {@code OBS_VALUE}, and attribute columns; one observation per row.
 * A download with labels writes {@code ID: Label} in headings and cells; {@code NaN} marks an
 * observation without a value (from memory, as SDMX-ML does). The flow, its dimensions
 * and the yields below are invented; only the layout is the standard's.
 */
class HistoryCsvReaderSdmxTest {

    @TempDir
    Path dir;
    private SeriesMap map;

    @BeforeEach
    void writeTheMap() throws Exception {
        Path file = dir.resolve("series.csv");
        Files.writeString(file, """
                series,curve,tenor
                # the desk's government curve
                D.XA.M3,GOVT-A,3M
                D.XA.Y10,GOVT-A,10Y
                D.XB.Y10,GOVT-B,10Y
                """);
        map = SeriesMap.read(file);
    }

    private List<CurveSnapshot> read(String csv) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("obs.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("unused", YieldUnit.PERCENT, YieldBounds.DEFAULT, map), out::add, () -> { });
        return out;
    }

    private HistoryFormatException refused(String csv) {
        return catchThrowableOfType(() -> read(csv), HistoryFormatException.class);
    }

    @Test
    void version1SortedBySeriesGivesEachCurvesSnapshotsInDateOrder() throws Exception {
        // sorted by series and then time, as a publisher writes it: GOVT-A's dates come round again for its second tenor
        List<CurveSnapshot> snapshots = read("""
                DATAFLOW,FREQ,REF_AREA,MATURITY,TIME_PERIOD,OBS_VALUE,OBS_STATUS
                DESK:YIELDS(1.0),D,XA,M3,2026-01-02,4.30,A
                DESK:YIELDS(1.0),D,XA,M3,2026-01-05,4.29,A
                DESK:YIELDS(1.0),D,XA,Y10,2026-01-02,4.24,A
                DESK:YIELDS(1.0),D,XA,Y10,2026-01-05,,M
                DESK:YIELDS(1.0),D,XB,Y10,2026-01-02,NaN,M
                DESK:YIELDS(1.0),D,XB,Y10,2026-01-05,3.10,A
                """);
        // an empty value and SDMX's NaN are missing: GOVT-A's 10Y of 01-05 and GOVT-B's whole 01-02
        assertThat(snapshots).extracting(s -> s.curve() + " " + s.date() + " " + s.asMap()).containsExactly(
                "GOVT-A 2026-01-02 {3M=430.0, 10Y=424.0}",
                "GOVT-A 2026-01-05 {3M=429.0}",
                "GOVT-B 2026-01-05 {10Y=310.0}");
    }

    @Test
    void version2WithLabelsReadsTheIdentifiers() throws Exception {
        List<CurveSnapshot> snapshots = read("""
                STRUCTURE,STRUCTURE_ID,ACTION,FREQ: Frequency,REF_AREA: Reference area,MATURITY: Maturity,TIME_PERIOD: Time,OBS_VALUE: Value
                dataflow,DESK:YIELDS(1.0),I,D: Daily,XA: Area A,M3: 3 months,2026-01-02,4.30
                dataflow,DESK:YIELDS(1.0),I,D: Daily,XA: Area A,Y10: 10 years,2026-01-02,4.24
                """);
        assertThat(snapshots).singleElement().satisfies(s -> {
            assertThat(s.date()).isEqualTo(LocalDate.of(2026, 1, 2));
            assertThat(s.asMap()).containsOnlyKeys(Tenor.months(3), Tenor.years(10));
        });
    }

    @Test
    void hostileFilesAreRefusedAtTheirLineAndColumn() throws Exception {
        String header = "DATAFLOW,FREQ,REF_AREA,MATURITY,TIME_PERIOD,OBS_VALUE\n";
        // a series the map does not name: "DESK:YIELDS(1.0)," is 17 characters, the key starts at 18
        assertThat(refused(header + "DESK:YIELDS(1.0),D,XA,Y30,2026-01-02,4.6\n").getMessage())
                .startsWith("obs.csv:2:18: series 'D.XA.Y30' is not in the series map ");
        // one observation twice, however far apart
        assertThat(refused(header + "DESK:YIELDS(1.0),D,XA,M3,2026-01-02,4.3\nDESK:YIELDS(1.0),D,XA,Y10,2026-01-02,4.2\n"
                + "DESK:YIELDS(1.0),D,XA,M3,2026-01-02,4.4\n").getMessage())
                .isEqualTo("obs.csv:4:26: second quote for GOVT-A 3M on 2026-01-02 (series D.XA.M3)");
        // a decimal comma makes a field too many ("DESK:YIELDS(1.0),D,XA,M3,2026-01-02,4," is 38 characters),
        // a value that is no number, and a row cut short
        assertThat(refused(header + "DESK:YIELDS(1.0),D,XA,M3,2026-01-02,4,3\n").getMessage())
                .isEqualTo("obs.csv:2:39: expected 6 fields as in the header, found 7");
        assertThat(refused(header + "DESK:YIELDS(1.0),D,XA,M3,2026-01-02,x\n").getMessage())
                .isEqualTo("obs.csv:2:37: unparsable number 'x' for 3M");
        assertThat(refused(header + "DESK:YIELDS(1.0),D,XA,M3,2026-01-02\n").getMessage())
                .isEqualTo("obs.csv:2:36: expected 6 fields as in the header, found 5");
        // no OBS_VALUE column
        assertThat(refused("DATAFLOW,FREQ,REF_AREA,MATURITY,TIME_PERIOD,VALUE\nDESK:YIELDS(1.0),D,XA,M3,2026-01-02,4.3\n").problem())
                .isEqualTo("an SDMX-CSV header needs the columns TIME_PERIOD and OBS_VALUE");
        // a deletion in 2.0: "dataflow,DESK:YIELDS(1.0)," is 26 characters
        assertThat(refused("STRUCTURE,STRUCTURE_ID,ACTION,FREQ,REF_AREA,MATURITY,TIME_PERIOD,OBS_VALUE\n"
                + "dataflow,DESK:YIELDS(1.0),D,D,XA,M3,2026-01-02,4.3\n").getMessage())
                .isEqualTo("obs.csv:2:27: ACTION D deletes observations: slopewatch reads quotes, not their removal");
    }

    @Test
    void withoutAMapTheFileIsRefusedAtItsHeaderAndAMapLineThatIsWrongAtItsLine() throws Exception {
        map = SeriesMap.NONE;
        assertThat(refused("DATAFLOW,FREQ,TIME_PERIOD,OBS_VALUE\nDESK:YIELDS(1.0),D,2026-01-02,4.3\n").getMessage())
                .startsWith("obs.csv:1:1: an SDMX-CSV file needs a series map");
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "D.XA.M3,GOVT-A,3M\nD.XA.Y10,GOVT-A,10 years\n");
        assertThatThrownBy(() -> SeriesMap.read(bad)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith(bad + ":2: unknown tenor '10 years'");
    }
}
