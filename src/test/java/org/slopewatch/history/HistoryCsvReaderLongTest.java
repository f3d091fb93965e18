package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/** The long layout {@code date,curve,tenor,yield}: rows in any tenor order become sorted snapshots, one per curve and date. */
class HistoryCsvReaderLongTest {

    // yields in whole basis points, so that the expected values are exact

    private static List<CurveSnapshot> read(String csv) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("test.csv", new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)),
                new HistoryCsvReader.Options("unused", YieldUnit.BASIS_POINTS, YieldBounds.DEFAULT), out::add, () -> { });
        return out;
    }

    @Test
    void rowsOfOneDateInAnyOrderBecomeOneSortedSnapshotPerCurve() throws Exception {
        List<CurveSnapshot> snapshots = read("""
                date,curve,tenor,yield
                2026-01-05,GOVT-B,10Y,450
                2026-01-05,GOVT-A,10y,410
                2026-01-05,GOVT-A, 3M ,390
                2026-01-05,GOVT-B,2Y,420
                2026-01-05,GOVT-A,2Y,
                2026-01-05,GOVT-A,12M,400
                2026-01-06,GOVT-A,3M,395
                """);
        // GOVT-A's 2026-01-05 is complete when its next date comes; GOVT-B's and GOVT-A's last at the end, in the order their quotes came
        assertThat(snapshots).extracting(s -> s.curve() + " " + s.date() + " " + s.asMap())
                .containsExactly(
                        "GOVT-A 2026-01-05 {3M=390.0, 1Y=400.0, 10Y=410.0}",
                        "GOVT-B 2026-01-05 {2Y=420.0, 10Y=450.0}",
                        "GOVT-A 2026-01-06 {3M=395.0}");
        assertThat(snapshots.get(0).tenor(1)).isEqualTo(Tenor.years(1));
    }

    @Test
    void aSecondQuoteForATenorIsRefusedWhateverItsSpelling() {
        assertThatThrownBy(() -> read("date,curve,tenor,yield\n2026-01-05,GOVT-A,1Y,4.1\n2026-01-05,GOVT-A,3M,4.0\n2026-01-05,GOVT-A,12m,4.2\n"))
                .isInstanceOf(HistoryFormatException.class)
                .hasMessageContaining("test.csv:4").hasMessageContaining("second quote for GOVT-A 1Y on 2026-01-05");
    }

    @Test
    void anUnknownTenorIsReportedOnEveryRowItAppearsOnNotOnlyTheFirst() {
        assertThatThrownBy(() -> read("date,curve,tenor,yield\n2026-01-05,GOVT-A,2Y,4.1\n2026-01-05,GOVT-B,2Y,4.1\n2026-01-05,GOVT-B,7Q,4.1\n"))
                .isInstanceOf(HistoryFormatException.class).hasMessageContaining("test.csv:4").hasMessageContaining("unknown tenor '7Q'");
    }
}
