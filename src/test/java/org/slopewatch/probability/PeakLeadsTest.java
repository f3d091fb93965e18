package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.tuple;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * One entry per business-cycle peak from the lead-time analysis's one row per confirmation, with
 * explicit dates. Peaks, troughs and announcement days: NBER business-cycle reference dates and
 * Business Cycle Dating Committee announcement dates (from memory), 2001-03/2001-11 announced
 * 2001-11-26, 2007-12/2009-06 announced 2008-12-01, 2020-02/2020-04 announced 2020-06-08. The
 * confirmations are invented; the data run from 1998-01 to 2021-12.
 */
class PeakLeadsTest {

    private static final List<Recession> NBER = List.of(
            new Recession(YearMonth.of(2001, 3), YearMonth.of(2001, 11), LocalDate.of(2001, 11, 26)),
            new Recession(YearMonth.of(2007, 12), YearMonth.of(2009, 6), LocalDate.of(2008, 12, 1)),
            new Recession(YearMonth.of(2020, 2), YearMonth.of(2020, 4), LocalDate.of(2020, 6, 8)));

    private static LeadTimeReport analyse(List<Recession> recessions, LocalDate... confirmed) {
        List<Confirmation> confirmations = Arrays.stream(confirmed).map(d -> new Confirmation(d, null)).toList();
        return new LeadTimeAnalysis(recessions, 24).analyse(confirmations, LocalDate.of(1998, 1, 2), LocalDate.of(2021, 12, 31));
    }

    private static PeakLead peak(LeadTimeReport r, YearMonth month) {
        return r.peaks().stream().filter(p -> p.peak().equals(month)).findFirst().orElseThrow();
    }

    @Test
    void aSecondConfirmationBeforeTheSamePeakIsNamedNotCounted() {
        // 2000-01 and 2000-11 both lead the 2001-03 peak (14 and 4 months); 2006-01 leads 2007-12 by 23 months
        LeadTimeReport r = analyse(NBER, LocalDate.of(2000, 1, 3), LocalDate.of(2000, 11, 1), LocalDate.of(2006, 1, 3),
                LocalDate.of(2012, 1, 3), LocalDate.of(2021, 6, 1));
        assertThat(r.leads()).as("the per-confirmation list keeps every confirmation").hasSize(5);
        assertThat(r.peaks()).extracting(PeakLead::peak, PeakLead::outcome, PeakLead::firstConfirmed, PeakLead::months).containsExactly(
                tuple(YearMonth.of(2001, 3), PeakLead.Outcome.AHEAD, LocalDate.of(2000, 1, 3), 14),
                tuple(YearMonth.of(2007, 12), PeakLead.Outcome.AHEAD, LocalDate.of(2006, 1, 3), 23),
                tuple(YearMonth.of(2020, 2), PeakLead.Outcome.MISSED, null, null));
        assertThat(peak(r, YearMonth.of(2001, 3)).laterConfirmations())
                .containsExactly(new PeakLead.LaterConfirmation(LocalDate.of(2000, 11, 1), 4));
        // 2012-01 is a false alarm (the next peak, 2020-02, is 97 months away) and 2021-06 pending: neither is a peak's
        assertThat(r.peaks()).hasSize(3);
    }

    @Test
    void aSignalAheadCameBeforeThePeakAndSoBeforeItsAnnouncement() {
        PeakLead p = peak(analyse(NBER, LocalDate.of(2006, 1, 3)), YearMonth.of(2007, 12));
        assertThat(p.timing()).isEqualTo(PeakLead.Timing.BEFORE_PEAK);
        assertThat(p.announced()).isEqualTo(LocalDate.of(2008, 12, 1));
        // 2006-01 to 2008-12: 35 months before the announcement
        assertThat(p.monthsBeforeAnnouncement()).isEqualTo(35);
    }

    @Test
    void aLateSignalBeforeTheAnnouncementWasStillNews() {
        // 2008-03-03: 3 months after the 2007-12 peak, 9 months before the 2008-12-01 announcement; 2009-01-02 follows, late too
        PeakLead p = peak(analyse(NBER, LocalDate.of(2008, 3, 3), LocalDate.of(2009, 1, 2)), YearMonth.of(2007, 12));
        assertThat(p.outcome()).isEqualTo(PeakLead.Outcome.LATE);
        assertThat(p.months()).isEqualTo(-3);
        assertThat(p.timing()).isEqualTo(PeakLead.Timing.BEFORE_ANNOUNCEMENT);
        assertThat(p.monthsBeforeAnnouncement()).isEqualTo(9);
        assertThat(p.laterConfirmations()).containsExactly(new PeakLead.LaterConfirmation(LocalDate.of(2009, 1, 2), -13));
    }

    @Test
    void aLateSignalOnOrAfterTheAnnouncementDayCameAfterBoth() {
        PeakLead onTheDay = peak(analyse(NBER, LocalDate.of(2008, 12, 1)), YearMonth.of(2007, 12));
        assertThat(onTheDay.timing()).isEqualTo(PeakLead.Timing.AFTER_BOTH);
        assertThat(onTheDay.monthsBeforeAnnouncement()).isZero();
        PeakLead after = peak(analyse(NBER, LocalDate.of(2009, 1, 2)), YearMonth.of(2007, 12));
        assertThat(after.timing()).isEqualTo(PeakLead.Timing.AFTER_BOTH);
        assertThat(after.monthsBeforeAnnouncement()).isEqualTo(-1);
        PeakLead dayBefore = peak(analyse(NBER, LocalDate.of(2008, 11, 28)), YearMonth.of(2007, 12));
        assertThat(dayBefore.timing()).isEqualTo(PeakLead.Timing.BEFORE_ANNOUNCEMENT);
    }

    @Test
    void withoutAnAnnouncementDateALateSignalIsOnlyAfterThePeak() {
        List<Recession> plain = NBER.stream().map(r -> new Recession(r.peak(), r.trough())).toList();
        PeakLead p = peak(analyse(plain, LocalDate.of(2008, 3, 3)), YearMonth.of(2007, 12));
        assertThat(p.timing()).isEqualTo(PeakLead.Timing.AFTER_PEAK);
        assertThat(p.announced()).isNull();
        assertThat(p.monthsBeforeAnnouncement()).isNull();
    }

    @Test
    void aMissedPeakHasNoSignalButKeepsItsAnnouncement() {
        PeakLead p = peak(analyse(NBER), YearMonth.of(2001, 3));
        assertThat(p.outcome()).isEqualTo(PeakLead.Outcome.MISSED);
        assertThat(p.timing()).isNull();
        assertThat(p.announced()).isEqualTo(LocalDate.of(2001, 11, 26));
        assertThat(analyse(NBER).peaks()).extracting(PeakLead::outcome).containsOnly(PeakLead.Outcome.MISSED).hasSize(3);
    }

    @Test
    void aPeakWhoseWindowStartsBeforeTheDataIsNotAssessedAndNotListed() {
        // data from 1998-01: an invented 1999-06 peak has only 17 months of data before it, less than the 24-month window;
        // the window of the 2001-03 peak starts 1999-03, inside the data
        List<Recession> withEarlier = List.of(new Recession(YearMonth.of(1999, 6), YearMonth.of(1999, 9)), NBER.get(0));
        LeadTimeReport r = analyse(withEarlier);
        assertThat(r.unassessedPeaks()).containsExactly(YearMonth.of(1999, 6));
        assertThat(r.peaks()).extracting(PeakLead::peak).containsExactly(YearMonth.of(2001, 3));
    }
}
