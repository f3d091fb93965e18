package org.slopewatch.replay;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.Watch;
import org.slopewatch.probability.SpreadObservation;
import org.slopewatch.spread.SpreadDefinition;

/**
 * Secondary-market bill rates, quoted on a bank-discount basis, in the files {@code replay} and
 * {@code fit} read: each layout declares the basis (a wide file in the column's heading,
 * {@code 13W:discount}; a long file in a {@code basis} column) and spells the bills in weeks, and
 * the spreads come out as if the bills had been given as bond-equivalent yields.
 *
 * <p>Source of the expected values: the U.S. Treasury's published formula for the bond-equivalent
 * (investment, coupon-equivalent) yield of a bill, computed here apart from the code under test
 * (from memory; the short form is also recorded in the shared reference notes). With {@code d} the
 * discount rate, {@code t} the days to maturity and {@code P = 100·(1 − d·t/360)}:
 * <pre>
 * t ≤ 182:  BEY = 365·d / (360 − d·t)
 * t &gt; 182:  BEY = [−2t/365 + 2·√((t/365)² − (2t/365 − 1)·(1 − 100/P))] / (2t/365 − 1)
 * </pre>
 * The 13-, 26- and 52-week bills run 91, 182 and 364 days. The invented curve GOVT-A carries a
 * 10-year yield of 4.00 % throughout.
 */
class BillBasisReplayTest {

    private static final double TEN_YEAR_PERCENT = 4.00;
    /** 13-week discount rates in percent, one month each; 5.00 and 15.50 are the levels of the check below. */
    private static final double[] BILL_13W = {0.25, 1.00, 2.50, 5.00, 7.75, 10.00, 12.50, 15.50};
    private static final Map<String, Integer> DAYS = Map.of("13W", 91, "26W", 182, "52W", 364);
    /** Spreads of the 13-, 26- and 52-week bills, which the files spell in weeks. */
    private static final List<String> SPREADS = List.of("10Y-3M", "10Y-6M", "10Y-1Y");

    private static LocalDate month(int i) {
        return LocalDate.of(2026, 1, 1).plusMonths(i);
    }

    /** The 26- and 52-week bills a little above the 13-week one, as a normal bill curve has them. */
    private static double discount(String bill, int row) {
        return BILL_13W[row] + (bill.equals("13W") ? 0 : bill.equals("26W") ? 0.10 : 0.20);
    }

    /** The published formula, in decimals, kept apart from {@code BillConversion}. */
    private static double treasuryBondEquivalent(double d, int t) {
        if (t <= 182) {
            return 365 * d / (360 - d * t);
        }
        double price = 100 * (1 - d * t / 360);
        double ty = t / 365.0;
        double a = 2 * ty - 1;
        return (-2 * ty + 2 * Math.sqrt(ty * ty - a * (1 - 100 / price))) / a;
    }

    /** The expected spread on each row, in bp: the 10-year less the bill's bond-equivalent yield. */
    private static double expectedBp(String bill, int row) {
        double bey = treasuryBondEquivalent(discount(bill, row) / 100, DAYS.get(bill));
        return TEN_YEAR_PERCENT * 100 - bey * 10_000;
    }

    private static String wideFile() {
        StringBuilder csv = new StringBuilder("date,13W:discount,26W:discount,52W:discount,10Y\n");
        for (int i = 0; i < BILL_13W.length; i++) {
            csv.append(month(i)).append(',').append(discount("13W", i)).append(',').append(discount("26W", i)).append(',')
                    .append(discount("52W", i)).append(',').append(TEN_YEAR_PERCENT).append('\n');
        }
        return csv.toString();
    }

    /** The same quotes in the long layout, the basis in its own column (empty for the 10-year: bond-equivalent). */
    private static String longFile() {
        StringBuilder csv = new StringBuilder("date,curve,tenor,yield,basis\n");
        for (int i = 0; i < BILL_13W.length; i++) {
            csv.append(month(i)).append(",GOVT-A,10Y,").append(TEN_YEAR_PERCENT).append(",\n");
            for (String bill : List.of("52W", "13W", "26W")) {
                csv.append(month(i)).append(",GOVT-A,").append(bill).append(',').append(discount(bill, i)).append(",discount\n");
            }
        }
        return csv.toString();
    }

    private static Map<String, SpreadValues> replay(String csv) throws Exception {
        List<Watch> watches = new ArrayList<>();
        for (String spread : SPREADS) {
            watches.add(new Watch(SpreadDefinition.parse(spread), MonitorDefinition.quarterAverageAtZero(), Set.of()));
        }
        Replay replay = new Replay(watches);
        replay.run("bills.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT), null, () -> { });
        Map<String, SpreadValues> out = new TreeMap<>();
        for (SpreadValues v : replay.values()) {
            out.put(v.spreadId(), v);
        }
        return out;
    }

    private static void assertSpreadsFollowTheTreasuryFormula(Map<String, SpreadValues> values) {
        assertThat(values.keySet()).as("every bill spread computed from bills spelt in weeks")
                .containsExactlyInAnyOrder("GOVT-A:10Y-3M", "GOVT-A:10Y-6M", "GOVT-A:10Y-1Y");
        for (int s = 0; s < SPREADS.size(); s++) {
            String bill = List.of("13W", "26W", "52W").get(s);
            SpreadValues v = values.get("GOVT-A:" + SPREADS.get(s));
            assertThat(v.size()).isEqualTo(BILL_13W.length);
            for (int i = 0; i < BILL_13W.length; i++) {
                assertThat(v.date(i)).isEqualTo(month(i));
                assertThat(v.valueBp(i)).as("%s on %s: 10Y less the Treasury bond-equivalent of %s %% discount",
                        SPREADS.get(s), month(i), discount(bill, i)).isCloseTo(expectedBp(bill, i), within(1e-6));
            }
        }
    }

    @Test
    void aWideFileDeclaringDiscountInItsHeadingsReplaysToBondEquivalentSpreads() throws Exception {
        assertSpreadsFollowTheTreasuryFormula(replay(wideFile()));
    }

    @Test
    void aLongFileWithABasisColumnReplaysToTheSameSpreads() throws Exception {
        assertSpreadsFollowTheTreasuryFormula(replay(longFile()));
    }

    @Test
    void readingTheDiscountRateAsIfBondEquivalentWouldOverstateTheSpreadBy13BpAt5PercentAnd86BpAt15Point5() throws Exception {
        // The figures stated for a 3-month bill: 13 bp at a 5 % discount rate, 86 bp at 15.5 %. Worked from the formula:
        // 365·0.05/(360 − 0.05·91) = 18.25/355.45 = 5.1343 %, 13.43 bp above 5.00 %;
        // 365·0.155/(360 − 0.155·91) = 56.575/345.895 = 16.3561 %, 85.61 bp above 15.50 %.
        SpreadValues tenThreeMonth = replay(wideFile()).get("GOVT-A:10Y-3M");
        for (int row : new int[] {3, 7}) {
            double asIfBondEquivalent = TEN_YEAR_PERCENT * 100 - BILL_13W[row] * 100;
            double overstated = asIfBondEquivalent - tenThreeMonth.valueBp(row);
            assertThat(overstated).as("overstatement at %s %%", BILL_13W[row]).isCloseTo(row == 3 ? 13 : 86, within(0.5));
        }
    }

    @Test
    void fitReadsTheSameSpreadFromADiscountBasisFile() throws Exception {
        SpreadSeries series = SpreadSeriesReader.read("bills.csv", new ByteArrayInputStream(longFile().getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT), SpreadDefinition.parse("10Y-3M"), null);
        List<SpreadObservation> observations = series.observations();
        assertThat(observations).hasSize(BILL_13W.length);
        for (int i = 0; i < BILL_13W.length; i++) {
            // the fit works in percentage points
            assertThat(observations.get(i).spreadPct()).isCloseTo(expectedBp("13W", i) / 100, within(1e-8));
        }
    }
}
