package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Lead times from confirmation and from re-steepening, with explicit dates. Peaks and troughs are
 * the NBER business-cycle reference dates (from memory) in src/test/resources/reference.
 */
class LeadTimeAnalysisTest {

    private static final LeadTimeAnalysis NBER = new LeadTimeAnalysis(ReferenceFiles.nberCalendar().recessions(),
            LeadTimeAnalysis.DEFAULT_WINDOW_MONTHS);

    private static LeadTime one(LocalDate confirmed, LocalDate resteepened, LocalDate dataEnd) {
        LeadTimeReport report = NBER.analyse(List.of(new Confirmation(confirmed, resteepened)), LocalDate.of(1985, 1, 1), dataEnd);
        assertThat(report.leads()).hasSize(1);
        return report.leads().get(0);
    }

    @Test
    void bothLeadsAreMeasuredToTheSamePeak() {
        // confirmed 2006-10, re-steepened 2007-06; NBER peak 2007-12
        LeadTime l = one(LocalDate.of(2006, 10, 2), LocalDate.of(2007, 6, 4), LocalDate.of(2010, 12, 31));
        assertThat(l.peak()).isEqualTo(YearMonth.of(2007, 12));
        assertThat(l.months()).isEqualTo(14);
        assertThat(l.monthsFromResteepening()).isEqualTo(6);
        assertThat(l.outcome()).isEqualTo("hit");
    }

    @Test
    void aReSteepeningAfterThePeakCountsBackwardsNotToTheNextCycle() {
        // confirmed 2000-10, re-steepened 2001-05 during the recession that followed the 2001-03 peak:
        // -2 months, not the 79 months to the 2007-12 peak
        LeadTime l = one(LocalDate.of(2000, 10, 2), LocalDate.of(2001, 5, 1), LocalDate.of(2010, 12, 31));
        assertThat(l.peak()).isEqualTo(YearMonth.of(2001, 3));
        assertThat(l.monthsFromResteepening()).isEqualTo(-2);
    }

    @Test
    void aSpellStillInvertedAtTheEndHasNoReSteepening() {
        LeadTime l = one(LocalDate.of(2006, 10, 2), null, LocalDate.of(2007, 3, 30));
        assertThat(l.resteepened()).isNull();
        assertThat(l.monthsFromResteepening()).isNull();
        assertThat(l.peak()).as("the peak is known from the dates even though the data stop before it").isEqualTo(YearMonth.of(2007, 12));
    }

    @Test
    void aFalseAlarmHasNoPeakToMeasureTheReSteepeningAgainst() {
        // confirmed 1998-10: no peak until 2001-03, 29 months later, outside the 24-month window
        LeadTime l = one(LocalDate.of(1998, 10, 1), LocalDate.of(1998, 12, 1), LocalDate.of(2003, 12, 31));
        assertThat(l.falseAlarm()).isTrue();
        assertThat(l.resteepened()).isEqualTo(LocalDate.of(1998, 12, 1));
        assertThat(l.monthsFromResteepening()).isNull();
    }

    @Test
    void aReSteepeningBeforeItsConfirmationIsRejected() {
        assertThatThrownBy(() -> new Confirmation(LocalDate.of(2007, 1, 2), LocalDate.of(2006, 12, 29)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("before the confirmation");
    }
}
