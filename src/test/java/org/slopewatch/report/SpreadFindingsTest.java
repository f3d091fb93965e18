package org.slopewatch.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.tuple;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.probability.Confirmation;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.LeadTimeAnalysis;
import org.slopewatch.probability.LeadTimeReport;
import org.slopewatch.probability.Recession;

/**
 * One finding per business-cycle peak from the lead-time analysis's one row per confirmation.
 * Peaks and troughs: NBER business-cycle reference dates (from memory): 2001-03/2001-11,
 * 2007-12/2009-06, 2020-02/2020-04. The confirmations are invented; data 1998-01 to 2021-12.
 */
class SpreadFindingsTest {

    private static final List<Recession> NBER = List.of(new Recession(YearMonth.of(2001, 3), YearMonth.of(2001, 11)),
            new Recession(YearMonth.of(2007, 12), YearMonth.of(2009, 6)), new Recession(YearMonth.of(2020, 2), YearMonth.of(2020, 4)));

    private static SpreadFindings findings(LocalDate... confirmed) {
        List<Confirmation> confirmations = Arrays.stream(confirmed).map(d -> new Confirmation(d, null)).toList();
        LeadTimeReport r = new LeadTimeAnalysis(NBER, 24).analyse(confirmations, LocalDate.of(1998, 1, 2), LocalDate.of(2021, 12, 31));
        SpreadSection s = new SpreadSection("GOVT-A:10Y-3M", "GOVT-A", "10Y-3M", "rules", "CONFIRMED", LocalDate.of(2021, 12, 31), -12.0,
                6_000, List.of(new ChartPoint(LocalDate.of(1998, 1, 2), 50.0)), List.of(), List.of(), r.leads(), r.missedPeaks(),
                r.unassessedPeaks(), null);
        return SpreadFindings.of(s);
    }

    @Test
    void eachPeakIsCreditedToItsFirstConfirmationBeforeIt() {
        SpreadFindings f = findings(LocalDate.of(2000, 1, 3), LocalDate.of(2000, 11, 1), LocalDate.of(2006, 1, 3),
                LocalDate.of(2008, 3, 3), LocalDate.of(2012, 1, 3), LocalDate.of(2021, 6, 1));
        assertThat(f.peaks()).extracting(PeakFinding::peak, PeakFinding::outcome).containsExactly(
                tuple(YearMonth.of(2001, 3), PeakFinding.Outcome.AHEAD),
                tuple(YearMonth.of(2007, 12), PeakFinding.Outcome.AHEAD),
                tuple(YearMonth.of(2020, 2), PeakFinding.Outcome.MISSED));
        // 2000-01 to 2001-03 is 14 months; the 2000-11 confirmation (4 months ahead) is named, not counted
        PeakFinding first = f.peaks().get(0);
        assertThat(first.first().confirmed()).isEqualTo(LocalDate.of(2000, 1, 3));
        assertThat(first.first().months()).isEqualTo(14);
        assertThat(first.later()).extracting(LeadTime::confirmed).containsExactly(LocalDate.of(2000, 11, 1));
        // 2006-01 to 2007-12: 23 months, within the window; 2008-03 came 3 months after the peak, late
        PeakFinding second = f.peaks().get(1);
        assertThat(second.first().months()).isEqualTo(23);
        assertThat(second.later()).extracting(LeadTime::months).containsExactly(-3);
        // 2012-01: the next peak, 2020-02, is 97 months away: a false alarm; 2021-06: its window runs past 2021-12
        assertThat(f.falseAlarms()).extracting(LeadTime::confirmed).containsExactly(LocalDate.of(2012, 1, 3));
        assertThat(f.pending()).extracting(LeadTime::confirmed).containsExactly(LocalDate.of(2021, 6, 1));
    }

    @Test
    void aPeakConfirmedOnlyAfterItIsLateByItsFirstConfirmation() {
        // 2008-03 and 2009-01 both fall inside the 2007-12 recession: 3 and 13 months after the peak
        SpreadFindings f = findings(LocalDate.of(2008, 3, 3), LocalDate.of(2009, 1, 2));
        PeakFinding p = f.peaks().stream().filter(x -> x.peak().equals(YearMonth.of(2007, 12))).findFirst().orElseThrow();
        assertThat(p.outcome()).isEqualTo(PeakFinding.Outcome.LATE);
        assertThat(p.first().months()).isEqualTo(-3);
        assertThat(p.later()).extracting(LeadTime::months).containsExactly(-13);
        // 2001-03 has a whole window of data before it (from 1998-01) and no confirmation: missed
        assertThat(f.peaks(PeakFinding.Outcome.MISSED)).extracting(PeakFinding::peak).containsExactly(YearMonth.of(2001, 3),
                YearMonth.of(2020, 2));
    }
}
