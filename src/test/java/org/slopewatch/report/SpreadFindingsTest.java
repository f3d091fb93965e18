package org.slopewatch.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.probability.Confirmation;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.LeadTimeAnalysis;
import org.slopewatch.probability.LeadTimeReport;
import org.slopewatch.probability.PeakLead;
import org.slopewatch.probability.Recession;

/**
 * The findings take each peak as the lead-time analysis decided it (PeakLeadsTest checks that
 * decision) and sort the remaining confirmations into false alarms and pending. Peaks and troughs:
 * NBER business-cycle reference dates (from memory): 2001-03/2001-11, 2007-12/2009-06,
 * 2020-02/2020-04. The confirmations are invented; data 1998-01 to 2021-12.
 */
class SpreadFindingsTest {

    private static final List<Recession> NBER = List.of(new Recession(YearMonth.of(2001, 3), YearMonth.of(2001, 11)),
            new Recession(YearMonth.of(2007, 12), YearMonth.of(2009, 6)), new Recession(YearMonth.of(2020, 2), YearMonth.of(2020, 4)));

    private static LeadTimeReport analyse(LocalDate... confirmed) {
        List<Confirmation> confirmations = Arrays.stream(confirmed).map(d -> new Confirmation(d, null)).toList();
        return new LeadTimeAnalysis(NBER, 24).analyse(confirmations, LocalDate.of(1998, 1, 2), LocalDate.of(2021, 12, 31));
    }

    private static SpreadFindings findings(LeadTimeReport r) {
        SpreadSection s = new SpreadSection("GOVT-A:10Y-3M", "GOVT-A", "10Y-3M", "rules", "CONFIRMED", LocalDate.of(2021, 12, 31), -12.0,
                6_000, List.of(new ChartPoint(LocalDate.of(1998, 1, 2), 50.0)), List.of(), List.of(), r.leads(), r.peaks(), r.missedPeaks(),
                r.unassessedPeaks(), null);
        return SpreadFindings.of(s);
    }

    @Test
    void eachPeakIsTheAnalysisOwnAndTheOtherConfirmationsAreFalseAlarmsOrPending() {
        LeadTimeReport r = analyse(LocalDate.of(2000, 1, 3), LocalDate.of(2000, 11, 1), LocalDate.of(2006, 1, 3),
                LocalDate.of(2008, 3, 3), LocalDate.of(2012, 1, 3), LocalDate.of(2021, 6, 1));
        SpreadFindings f = findings(r);
        assertThat(f.peaks()).as("taken as decided, not regrouped").isEqualTo(r.peaks());
        assertThat(f.peaks(PeakLead.Outcome.AHEAD)).extracting(PeakLead::peak).containsExactly(YearMonth.of(2001, 3), YearMonth.of(2007, 12));
        assertThat(f.peaks(PeakLead.Outcome.MISSED)).extracting(PeakLead::peak).containsExactly(YearMonth.of(2020, 2));
        // 2012-01: the next peak, 2020-02, is 97 months away: a false alarm; 2021-06: its window runs past 2021-12
        assertThat(f.falseAlarms()).extracting(LeadTime::confirmed).containsExactly(LocalDate.of(2012, 1, 3));
        assertThat(f.pending()).extracting(LeadTime::confirmed).containsExactly(LocalDate.of(2021, 6, 1));
        assertThat(f.notAssessed()).isEmpty();
    }

    @Test
    void withoutRecessionDatesThereAreNoPeaks() {
        SpreadSection s = new SpreadSection("GOVT-A:10Y-3M", "GOVT-A", "10Y-3M", "rules", "NORMAL", null, null, 0, List.of(), List.of(),
                List.of(), null, null, null, null, null);
        SpreadFindings f = SpreadFindings.of(s);
        assertThat(f.peaks()).isEmpty();
        assertThat(f.notAssessed()).isEmpty();
        assertThat(f.falseAlarms()).isEmpty();
    }
}
