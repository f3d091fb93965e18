package org.slopewatch.ingest.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.slopewatch.ingest.demo.PolicyPath.Knot;

/** The scripted gap: flat outside its knots, linear in calendar days between them. */
class PolicyPathTest {

    private static final LocalDate START = LocalDate.of(2026, 1, 5);
    private static final PolicyPath PATH = PolicyPath.of(new Knot(1, -100), new Knot(3, 300), new Knot(4, 0));

    @Test
    void theGapIsFlatBeforeTheFirstKnotAndAfterTheLast() {
        assertThat(PATH.gapBp(START, START)).isEqualTo(-100);
        assertThat(PATH.gapBp(START, LocalDate.of(2026, 2, 5))).isEqualTo(-100);
        assertThat(PATH.gapBp(START, LocalDate.of(2026, 5, 5))).isEqualTo(0);
        assertThat(PATH.gapBp(START, LocalDate.of(2040, 1, 1))).as("the script is over; the gap stays put").isEqualTo(0);
        assertThat(PATH.scriptMonths()).isEqualTo(4);
    }

    @Test
    void betweenKnotsTheGapIsLinearInCalendarDays() {
        // 2026-02-05 to 2026-04-05 is 59 days; 2026-03-07 is 30 of them
        assertThat(PATH.gapBp(START, LocalDate.of(2026, 3, 7))).isCloseTo(-100 + 400.0 * 30 / 59, within(1e-9));
        assertThat(PATH.gapBp(START, LocalDate.of(2026, 4, 5))).isEqualTo(300);
    }

    @Test
    void knotsOutOfOrderAreRejected() {
        assertThatThrownBy(() -> PolicyPath.of(new Knot(3, 0), new Knot(3, 1))).hasMessageContaining("increasing month order");
        assertThatThrownBy(() -> PolicyPath.of()).hasMessageContaining("at least one knot");
    }
}
