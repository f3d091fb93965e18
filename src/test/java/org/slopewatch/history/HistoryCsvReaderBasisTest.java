package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/**
 * A history file declares the basis of its quotes as a JSON quote's {@code basis} field does
 * ({@code bond-equivalent}, {@code discount}): a wide file per column ({@code 13W:discount}), a
 * long file per row (a {@code basis} column); bills spelt in weeks sit on the month points.
 *
 * <p>Expected values: the U.S. Treasury's formula for the bond-equivalent yield of a bill of at
 * most 182 days, {@code BEY = 365·d / (360 − d·t)} (from memory; also recorded in the shared
 * reference notes), worked by hand beside each check.
 */
class HistoryCsvReaderBasisTest {

    private static List<CurveSnapshot> read(String csv) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("test.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT), out::add, () -> { });
        return out;
    }

    @Test
    void aDiscountColumnIsConvertedOverTheDaysOfTheBillAsWritten() throws Exception {
        // 13W = 91 days at 5.00 %: 365·0.05 / (360 − 4.55) = 18.25 / 355.45 = 5.13434 %
        // 26W = 182 days at 5.00 %: 365·0.05 / (360 − 9.1) = 18.25 / 350.9 = 5.20091 %
        // 3M written as such is 91 days too (round(3·365/12) = 91)
        List<CurveSnapshot> wide = read("date,10Y,13W:discount,26W : discount\n2026-01-05,4.0,5.00,5.00\n");
        assertThat(wide).hasSize(1);
        assertThat(wide.get(0).asMap().keySet()).containsExactly(Tenor.months(3), Tenor.months(6), Tenor.years(10));
        assertThat(wide.get(0).yieldBp(Tenor.months(3))).isCloseTo(513.434, within(1e-3));
        assertThat(wide.get(0).yieldBp(Tenor.months(6))).isCloseTo(520.091, within(1e-3));
        assertThat(wide.get(0).yieldBp(Tenor.years(10))).isEqualTo(400.0);
        List<CurveSnapshot> threeMonth = read("date,3M:discount,10Y:bond-equivalent\n2026-01-05,5.00,4.0\n");
        assertThat(threeMonth.get(0).yieldBp(Tenor.months(3))).isCloseTo(513.434, within(1e-3));
    }

    @Test
    void aLongFileSaysTheBasisRowByRowAndAnEmptyCellIsBondEquivalent() throws Exception {
        List<CurveSnapshot> snapshots = read("""
                date,curve,tenor,yield,basis
                2026-01-05,GOVT-A,13W,5.00,discount
                2026-01-05,GOVT-A,10Y,4.00,
                2026-01-05,GOVT-B,3M,5.00,bond-equivalent
                2026-01-05,GOVT-B,10Y,4.00,bond-equivalent
                """);
        assertThat(snapshots).extracting(CurveSnapshot::curve).containsExactly("GOVT-A", "GOVT-B");
        assertThat(snapshots.get(0).yieldBp(Tenor.months(3))).isCloseTo(513.434, within(1e-3));
        assertThat(snapshots.get(0).yieldBp(Tenor.years(10))).isEqualTo(400.0);
        assertThat(snapshots.get(1).yieldBp(Tenor.months(3))).isEqualTo(500.0);
    }

    @Test
    void billsSpeltInWeeksAreTheMonthPointsOnTheBondEquivalentBasisToo() throws Exception {
        List<CurveSnapshot> snapshots = read("date,52W,13W,26W,4W\n2026-01-05,4.1,4.3,4.2,4.4\n");
        // 4W has no alias: it stays a point of its own
        assertThat(snapshots.get(0).asMap().keySet()).containsExactly(Tenor.weeks(4), Tenor.months(3), Tenor.months(6), Tenor.years(1));
        assertThat(snapshots.get(0).yieldBp(Tenor.years(1))).isCloseTo(410.0, within(1e-9)); // 4.1 % in bp, as binary floating point has it
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            // columns counted by hand: "date,3M," is 8 characters, the heading starts at 9
            "unknown basis in a heading   | date,3M,10Y:Discount\\n2026-01-05,5.0,4.0\\n | test.csv:1:9: unknown basis 'Discount' (accepted: bond-equivalent, discount)",
            "discount on a note           | date,3M,2Y:discount\\n2026-01-05,5.0,4.0\\n  | test.csv:1:9: discount basis applies to bills up to 52W, not 2Y",
            "discount on a 1Y point       | date,1Y:discount\\n2026-01-05,5.0\\n          | test.csv:1:6: discount basis applies to bills up to 52W, not 1Y",
            "a mark and no basis          | date,13W:\\n2026-01-05,5.0\\n                 | test.csv:1:6: nothing after ':'",
            "a bill twice by its alias    | date,3M,13W:discount\\n2026-01-05,5.0,5.0\\n | test.csv:1:9: tenor 3M appears twice in the header (13W is read as 3M)",
            "a basis column in a wide file| date,basis,3M\\n2026-01-05,discount,5.0\\n  | test.csv:1:6: a wide file declares the basis in a column's heading",
            // "2026-01-05,GOVT-A,13W,5.0," is 26 characters: the basis starts at 27
            "unknown basis in a row       | date,curve,tenor,yield,basis\\n2026-01-05,GOVT-A,13W,5.0,discount\\n2026-01-05,GOVT-A,10Y,4.0,bey\\n | test.csv:3:27: unknown basis 'bey'",
            "discount on a note in a row  | date,curve,tenor,yield,basis\\n2026-01-05,GOVT-A,10Y,4.0,discount\\n | test.csv:2:27: discount basis applies to bills up to 52W, not 10Y",
            // "2026-01-05,GOVT-A," is 18 characters: the tenor starts at 19
            "a bill twice in a long file  | date,curve,tenor,yield,basis\\n2026-01-05,GOVT-A,3M,5.0,\\n2026-01-05,GOVT-A,13W,5.0,discount\\n | test.csv:3:19: second quote for GOVT-A 3M on 2026-01-05 (13W is read as 3M)",
            "a basis column twice         | date,curve,tenor,yield,basis,basis\\n2026-01-05,GOVT-A,3M,5.0,,\\n | test.csv:1:30: column 'basis' appears twice in the header",
    })
    void aBasisThatCannotApplyIsRefusedAtItsLineAndColumn(String name, String text, String expected) {
        assertThat(HistoryCsvReaderFormatTest.refusal(text.replace("\\n", "\n").getBytes(StandardCharsets.UTF_8))).startsWith(expected);
    }
}
