package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Source: linear interpolation y = y0 + (t − t0)/(t1 − t0)·(y1 − y0), worked by hand below. */
class CurveSnapshotTest {

    private static final LocalDate DATE = LocalDate.of(2019, 8, 30);
    private final CurveSnapshot snapshot = CurveSnapshot.of("GOVT-A", DATE,
            Map.of(Tenor.months(3), 199.0, Tenor.years(2), 150.0, Tenor.years(5), 138.0, Tenor.years(10), 152.0));

    @Test
    void interpolatesLinearlyBetweenNeighbours() {
        // 3Y between 2Y (150) and 5Y (138): 150 + (3 − 2)/(5 − 2)·(138 − 150) = 150 − 4 = 146
        assertThat(snapshot.interpolatedBp(Tenor.years(3))).isCloseTo(146.0, within(1e-9));
        // 7Y between 5Y (138) and 10Y (152): 138 + (7 − 5)/(10 − 5)·14 = 138 + 5.6 = 143.6
        assertThat(snapshot.interpolatedBp(Tenor.years(7))).isCloseTo(143.6, within(1e-9));
        // 1Y between 3M (199) and 2Y (150): 199 + (1 − 0.25)/(2 − 0.25)·(−49) = 199 − 21 = 178
        assertThat(snapshot.interpolatedBp(Tenor.years(1))).isCloseTo(178.0, within(1e-9));
    }

    @Test
    void quotedTenorIsReturnedAsQuoted() {
        assertThat(snapshot.interpolatedBp(Tenor.years(5))).isEqualTo(138.0);
        assertThat(snapshot.yieldBp(Tenor.years(3))).as("not quoted").isNaN();
    }

    @Test
    void outsideTheQuotedRangeIsNaN() {
        assertThat(snapshot.interpolatedBp(Tenor.months(1))).isNaN();
        assertThat(snapshot.interpolatedBp(Tenor.years(30))).isNaN();
    }

    @Test
    void sortedColumnsOutOfOrderAreRejected() {
        Tenor[] tenors = {Tenor.years(10), Tenor.years(2)};
        assertThatThrownBy(() -> CurveSnapshot.ofSorted("GOVT-A", DATE, tenors, new double[] {1, 2}))
                .hasMessageContaining("10Y, 2Y");
    }
}
