package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/**
 * The Federal Reserve's H.15 data download CSV, read as it is published.
 *
 * <p>Layout (from memory of the Board's Data Download Program, "Selected Interest Rates (Daily) -
 * H.15", CSV with series descriptions): five description rows, each a label and one cell per
 * series ({@code Series Description}, {@code Unit:}, {@code Multiplier:}, {@code Currency:},
 * {@code Unique Identifier: }), then the header {@code Time Period} followed by the series'
 * identifiers, then one row per day with ISO dates, oldest first, {@code ND} where there is no
 * data (holidays). Identifiers (from memory): {@code RIFLGFCM03_N.B} the 3-month and
 * {@code RIFLGFCY10_N.B} the 10-year constant maturity, daily ({@code B}); {@code RIFSPFF_N.B} the
 * federal funds rate. The yields below are invented; only the layout is the Board's.
 */
class HistoryCsvReaderH15Test {

    static final String DESCRIPTIONS = """
            "Series Description","Market yield on U.S. Treasury securities at 3-month   constant maturity, quoted on investment basis","Market yield on U.S. Treasury securities at 2-year   constant maturity, quoted on investment basis","Market yield on U.S. Treasury securities at 10-year   constant maturity, quoted on investment basis"
            "Unit:","Percent:_Per_Year","Percent:_Per_Year","Percent:_Per_Year"
            "Multiplier:","1","1","1"
            "Currency:","NA","NA","NA"
            "Unique Identifier: ","H15/H15/RIFLGFCM03_N.B","H15/H15/RIFLGFCY02_N.B","H15/H15/RIFLGFCY10_N.B"
            """;
    static final String HEADER = "\"Time Period\",\"RIFLGFCM03_N.B\",\"RIFLGFCY02_N.B\",\"RIFLGFCY10_N.B\"\n";

    private static List<CurveSnapshot> read(String csv) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("h15.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("GOVT-CMT", YieldUnit.PERCENT, YieldBounds.DEFAULT), out::add, () -> { });
        return out;
    }

    private static HistoryFormatException refused(String csv) {
        return catchThrowableOfType(() -> read(csv), HistoryFormatException.class);
    }

    @Test
    void theSeriesAreReadAsTheTenorsTheirIdentifiersNameAndNoDataIsMissing() throws Exception {
        List<CurveSnapshot> snapshots = read(DESCRIPTIONS + HEADER + """
                2026-01-01,ND,ND,ND
                2026-01-02,4.30,3.90,4.24
                2026-01-05,4.29,ND,4.23
                """);
        // New Year's Day is all ND: a row with no quote, no snapshot
        assertThat(snapshots).extracting(CurveSnapshot::date).containsExactly(LocalDate.of(2026, 1, 2), LocalDate.of(2026, 1, 5));
        assertThat(snapshots).extracting(CurveSnapshot::curve).containsOnly("GOVT-CMT");
        assertThat(snapshots.get(0).asMap()).containsOnlyKeys(Tenor.months(3), Tenor.years(2), Tenor.years(10));
        assertThat(snapshots.get(0).yieldBp(Tenor.months(3))).isEqualTo(430.0);
        assertThat(snapshots.get(1).asMap()).containsOnlyKeys(Tenor.months(3), Tenor.years(10));
    }

    @Test
    void hostileFilesAreRefusedAtTheirLineAndColumn() {
        // a series that is no Treasury constant maturity: the federal funds rate in the third column
        HistoryFormatException funds = refused(DESCRIPTIONS.replace("RIFLGFCY02_N.B", "RIFSPFF_N.B")
                + HEADER.replace("RIFLGFCY02_N.B", "RIFSPFF_N.B") + "2026-01-02,4.30,3.90,4.24\n");
        assertThat(funds.line()).isEqualTo(6);
        assertThat(funds.problem()).startsWith("series 'RIFSPFF_N.B' is no Treasury constant-maturity yield");
        // a unit other than percent, at its cell: '"Unit:","Percent:_Per_Year",' is 28 characters
        HistoryFormatException unit = refused(DESCRIPTIONS.replaceFirst("\"Percent:_Per_Year\",\"Percent", "\"Percent:_Per_Year\",\"Basis_points")
                + HEADER + "2026-01-02,4.30,3.90,4.24\n");
        assertThat(unit.getMessage()).isEqualTo("h15.csv:2:29: unit 'Basis_points:_Per_Year': only percent is read");
        // cut short before the header
        HistoryFormatException cut = refused(DESCRIPTIONS);
        assertThat(cut.line()).isEqualTo(6);
        assertThat(cut.problem()).isEqualTo("the H.15 file ends before its 'Time Period' header: is it cut short?");
        // a date twice, and a cell that is no number ("2026-01-05,4.29," is 16 characters)
        assertThat(refused(DESCRIPTIONS + HEADER + "2026-01-02,4.30,3.90,4.24\n2026-01-02,4.30,3.90,4.24\n").getMessage())
                .isEqualTo("h15.csv:8:1: date 2026-01-02 appears twice");
        assertThat(refused(DESCRIPTIONS + HEADER + "2026-01-02,4.30,3.90,4.24\n2026-01-05,4.29,#N/A,4.23\n").getMessage())
                .isEqualTo("h15.csv:8:17: unparsable number '#N/A' for 2Y");
        // a row with a column too few
        assertThat(refused(DESCRIPTIONS + HEADER + "2026-01-02,4.30,3.90\n").getMessage())
                .isEqualTo("h15.csv:7:21: expected 4 fields as in the header, found 3");
        // a description row with a cell too few
        assertThat(refused(DESCRIPTIONS.replace("\"Currency:\",\"NA\",\"NA\",\"NA\"", "\"Currency:\",\"NA\",\"NA\"") + HEADER).line())
                .isEqualTo(4);
    }
}
