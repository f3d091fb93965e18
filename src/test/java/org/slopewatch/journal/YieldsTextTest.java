package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SortedMap;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;

class YieldsTextTest {

    @Test
    void readGivesBackExactlyWhatWriteStored() {
        SortedMap<Tenor, Double> yields = new TreeMap<>();
        yields.put(Tenor.weeks(4), 512.25);
        yields.put(Tenor.months(3), 0.1 + 0.2); // not exactly 0.3: the text must round-trip every bit
        yields.put(Tenor.years(10), -12.5);
        yields.put(Tenor.years(30), 4.9e-7);

        String text = YieldsText.write(yields);

        assertThat(text).as("the documented form, shortest maturity first").startsWith("4W=512.25;3M=");
        assertThat(YieldsText.read(text)).as("twice, so the second read comes from the tenor cache").isEqualTo(yields);
        assertThat(YieldsText.read(text)).isEqualTo(yields);
    }

    @Test
    void aSingleTenorNeedsNoSeparator() {
        assertThat(YieldsText.read("10Y=421.5")).containsExactly(java.util.Map.entry(Tenor.years(10), 421.5));
    }

    @Test
    void aPairWithoutItsValueIsRejectedRatherThanJoinedToTheNext() {
        assertThatThrownBy(() -> YieldsText.read("3M;10Y=421.5")).isInstanceOf(IllegalArgumentException.class);
    }
}
