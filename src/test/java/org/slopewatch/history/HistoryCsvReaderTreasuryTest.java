package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

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
 * The U.S. Treasury's daily par yield curve CSV, read as it is published.
 *
 * <p>Layout (from memory of the Treasury's "Daily Treasury Par Yield Curve Rates" CSV download):
 * a header {@code Date,"1 Mo","2 Mo","3 Mo","4 Mo","6 Mo","1 Yr","2 Yr","3 Yr","5 Yr","7 Yr","10 Yr","20 Yr","30 Yr"},
 * since 2025 with {@code "1.5 Month"} for the six-week bill; one row per business day, dates
 * {@code MM/DD/YYYY}, newest first; a maturity not quoted that day is an empty cell; yields in
 * percent, bond-equivalent. The yields below are invented; only the layout is the Treasury's.
 */
class HistoryCsvReaderTreasuryTest {

    static final String HEADER = "Date,\"1 Mo\",\"2 Mo\",\"3 Mo\",\"4 Mo\",\"6 Mo\",\"1 Yr\",\"2 Yr\",\"3 Yr\",\"5 Yr\",\"7 Yr\",\"10 Yr\",\"20 Yr\",\"30 Yr\"\n";

    private static List<CurveSnapshot> read(String csv, YieldUnit unit) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("par.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("GOVT-PAR", unit, YieldBounds.DEFAULT), out::add, () -> { });
        return out;
    }

    private static HistoryFormatException refused(String csv) {
        return catchThrowableOfType(() -> read(csv, YieldUnit.PERCENT), HistoryFormatException.class);
    }

    @Test
    void aNewestFirstFileIsHandedOnOldestFirstWithTheTreasurysMaturitiesAsTenors() throws Exception {
        List<CurveSnapshot> snapshots = read(HEADER
                + "01/06/2026,4.31,4.30,4.28,4.25,4.20,4.05,3.90,3.88,3.95,4.10,4.22,4.55,4.50\n"
                + "01/05/2026,4.32,4.31,4.29,,4.21,4.06,3.91,3.89,3.96,4.11,4.23,4.56,4.51\n"
                + "01/02/2026,4.33,4.32,4.30,4.27,4.22,4.07,3.92,3.90,3.97,4.12,4.24,4.57,4.52\n", YieldUnit.PERCENT);
        // 01/01 is a holiday: the Treasury publishes no row for it, and none is made up
        assertThat(snapshots).extracting(CurveSnapshot::date).containsExactly(
                LocalDate.of(2026, 1, 2), LocalDate.of(2026, 1, 5), LocalDate.of(2026, 1, 6));
        assertThat(snapshots).extracting(CurveSnapshot::curve).containsOnly("GOVT-PAR");
        CurveSnapshot first = snapshots.get(0);
        assertThat(first.asMap().keySet()).containsExactly(Tenor.months(1), Tenor.months(2), Tenor.months(3), Tenor.months(4),
                Tenor.months(6), Tenor.years(1), Tenor.years(2), Tenor.years(3), Tenor.years(5), Tenor.years(7), Tenor.years(10),
                Tenor.years(20), Tenor.years(30));
        assertThat(first.yieldBp(Tenor.years(10))).isEqualTo(424.0);
        assertThat(first.yieldBp(Tenor.months(3))).isEqualTo(430.0);
        // the empty 4 Mo cell of 01/05 is a missing value, the others of the row stand
        assertThat(snapshots.get(1).asMap()).doesNotContainKey(Tenor.months(4)).containsKey(Tenor.months(6));
    }

    @Test
    void theSixWeekBillIsASixWeekPointAndAnOldestFirstFileReadsAlike() throws Exception {
        List<CurveSnapshot> snapshots = read("Date,\"1 Mo\",\"1.5 Month\",\"3 Mo\",\"10 Yr\"\n"
                + "03/02/2026,4.30,4.29,4.25,4.10\n"
                + "03/03/2026,4.31,4.28,4.24,4.12\n", YieldUnit.PERCENT);
        assertThat(snapshots).extracting(CurveSnapshot::date).containsExactly(LocalDate.of(2026, 3, 2), LocalDate.of(2026, 3, 3));
        assertThat(snapshots.get(0).asMap().keySet()).containsExactly(Tenor.months(1), Tenor.weeks(6), Tenor.months(3), Tenor.years(10));
        assertThat(snapshots.get(0).yieldBp(Tenor.weeks(6))).isEqualTo(429.0);
    }

    @Test
    void theTreasurysPercentHoldsWhateverUnitIsAskedFor() throws Exception {
        // the layout states percent: read as basis points, 4.10 would be a 4 bp yield
        List<CurveSnapshot> snapshots = read("Date,\"3 Mo\",\"10 Yr\"\n03/02/2026,4.25,4.10\n", YieldUnit.BASIS_POINTS);
        assertThat(snapshots.get(0).yieldBp(Tenor.years(10))).isCloseTo(410.0, within(1e-9));
    }

    @Test
    void hostileFilesAreRefusedAtTheirLineAndColumn() {
        // a date twice (a revision is sent as a file of its own, not a second row)
        HistoryFormatException twice = refused("Date,\"3 Mo\",\"10 Yr\"\n01/06/2026,4.2,4.1\n01/06/2026,4.3,4.1\n");
        assertThat(twice.getMessage()).isEqualTo("par.csv:3:1: date 2026-01-06 appears twice");
        // a date out of the file's direction, newest first
        HistoryFormatException order = refused("Date,\"3 Mo\",\"10 Yr\"\n01/06/2026,4.2,4.1\n01/05/2026,4.2,4.1\n01/07/2026,4.2,4.1\n");
        assertThat(order.getMessage()).isEqualTo("par.csv:4:1: dates out of order: 2026-01-07 after 2026-01-05 in a file whose dates descend");
        // a cell that is no number: "01/06/2026,4.2," is 15 characters, the cell starts at 16
        HistoryFormatException cell = refused("Date,\"3 Mo\",\"10 Yr\"\n01/06/2026,4.2,n/a!\n");
        assertThat(cell.getMessage()).isEqualTo("par.csv:2:16: unparsable number 'n/a!' for 10Y");
        // a row cut short, as a truncated download ends
        HistoryFormatException cut = refused("Date,\"3 Mo\",\"10 Yr\"\n01/06/2026,4.2,4.1\n01/05/2026,4.2");
        assertThat(cut.getMessage()).isEqualTo("par.csv:3:15: expected 3 fields as in the header, found 2");
        // a column that is no maturity of the Treasury's: "Date,\"3 Mo\"," is 12 characters
        HistoryFormatException column = refused("Date,\"3 Mo\",Spread,\"10 Yr\"\n01/06/2026,4.2,0.1,4.1\n");
        assertThat(column.line()).isEqualTo(1);
        assertThat(column.column()).isEqualTo(13);
        assertThat(column.problem()).startsWith("unknown maturity 'Spread' in a Treasury par yield file");
        // an ISO date where the Treasury writes month/day/year
        HistoryFormatException iso = refused("Date,\"3 Mo\",\"10 Yr\"\n2026-01-06,4.2,4.1\n");
        assertThat(iso.getMessage()).isEqualTo("par.csv:2:1: unparsable date '2026-01-06' (expected MM/DD/YYYY, as the Treasury writes it)");
    }
}
