package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.io.StringReader;
import java.time.LocalDate;
import java.time.YearMonth;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class RecessionCalendarTest {

    private static final RecessionCalendar NBER = ReferenceFiles.nberCalendar();

    /**
     * Contraction lengths, peak to trough, in months, as the NBER business-cycle chronology
     * tabulates them (from memory). With the convention "after the peak through the trough,
     * inclusive" the number of recession months equals that published length.
     */
    @ParameterizedTest(name = "{0}: {1} months")
    @CsvSource({
            "1948-11, 11", "1953-07, 10", "1957-08, 8", "1960-04, 10", "1969-12, 11", "1973-11, 16",
            "1980-01, 6", "1981-07, 16", "1990-07, 8", "2001-03, 8", "2007-12, 18", "2020-02, 2"})
    void recessionMonthsMatchThePublishedContractionLengths(String peak, int publishedMonths) {
        YearMonth p = YearMonth.parse(peak);
        assertThat(NBER.inRecession(p)).as("the peak month itself is the last month of expansion").isFalse();
        int count = 0;
        YearMonth m = p.plusMonths(1);
        while (NBER.inRecession(m)) {
            count++;
            m = m.plusMonths(1);
        }
        assertThat(count).as("NBER contraction length after the %s peak (from memory)", peak)
                .isEqualTo(publishedMonths);
    }

    @Test
    void troughMonthIsInsideAndTheNextMonthOutside() {
        // 1973-11 peak, 1975-03 trough (NBER reference dates, from memory)
        assertThat(NBER.inRecession(YearMonth.of(1973, 12))).isTrue();
        assertThat(NBER.inRecession(YearMonth.of(1975, 3))).isTrue();
        assertThat(NBER.inRecession(YearMonth.of(1975, 4))).isFalse();
        assertThat(NBER.inRecession(YearMonth.of(1999, 9))).as("between 1991 and 2001").isFalse();
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "peak,trough\\n1990-07,1991-13 | holidays.csv:2: trough '1991-13' is not a valid month",
            "peak,trough\\n1990-07 | holidays.csv:2: expected 2 columns",
            "peak,trough\\n\\n1990-7,1991-03 | holidays.csv:3: peak '1990-7' is not a month in the form YYYY-MM",
            "peak,trough\\n1991-03,1990-07 | holidays.csv:2: trough 1990-07 must come after peak 1991-03",
            "peak,trough\\n1990-07, | holidays.csv:2: trough is empty",
            "peak,trough\\n1990-07,1991-03\\n1991-01,1991-06 | holidays.csv:3: peak 1991-01 comes before the previous trough 1991-03",
            "start,end\\n1990-07,1991-03 | holidays.csv:1: expected the header 'peak,trough' or 'peak,trough,peak_announced'",
            "peak,trough,peak_announced\\n1990-07,1991-03 | holidays.csv:2: expected 3 columns 'peak,trough,peak_announced', found 2",
            "peak,trough\\n1990-07,1991-03,1991-04-25 | holidays.csv:2: expected 2 columns 'peak,trough', found 3",
            "peak,trough,peak_announced\\n1990-07,1991-03,1991-04 | holidays.csv:2: peak_announced '1991-04' is not a date in the form YYYY-MM-DD",
            "peak,trough,peak_announced\\n1990-07,1991-03,1991-02-30 | holidays.csv:2: peak_announced '1991-02-30' is not a valid date",
            "peak,trough,peak_announced\\n1990-07,1991-03,1990-07-31 | holidays.csv:2: peak_announced 1990-07-31 must come after the peak month 1990-07"})
    void badRowsAreReportedWithFileAndLine(String content, String expected) {
        String text = content.replace("\\n", "\n");
        assertThatThrownBy(() -> RecessionCalendarCsv.read(new StringReader(text), "holidays.csv"))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith(expected);
    }

    @Test
    void anEmptyFileIsAnError() {
        assertThatThrownBy(() -> RecessionCalendarCsv.read(new StringReader(""), "empty.csv"))
                .hasMessageContaining("empty.csv").hasMessageContaining("header");
    }

    @Test
    void readsTheReferenceFileCompletely() {
        // us-business-cycle-dates.csv: twelve peak/trough pairs, 1948-11 to 2020-04; the February 2020 peak was
        // announced on 2020-06-08 (NBER Business Cycle Dating Committee announcement dates, from memory)
        assertThat(NBER.recessions()).hasSize(12);
        assertThat(NBER.recessions().get(11)).isEqualTo(new Recession(YearMonth.of(2020, 2), YearMonth.of(2020, 4), LocalDate.of(2020, 6, 8)));
    }

    @Test
    void theReferenceFileGivesAnAnnouncementForEachPeakTheCommitteeAnnouncedAndNoneBefore() {
        // NBER Business Cycle Dating Committee announcement dates (from memory; see reference/README.md): the committee
        // announced the peaks from 1980 on; the earlier ones were dated in retrospect
        assertThat(NBER.recessions()).extracting(Recession::peakAnnounced).containsExactly(null, null, null, null, null, null,
                LocalDate.of(1980, 6, 3), LocalDate.of(1982, 1, 6), LocalDate.of(1991, 4, 25), LocalDate.of(2001, 11, 26),
                LocalDate.of(2008, 12, 1), LocalDate.of(2020, 6, 8));
    }

    @Test
    void aFileWithoutTheAnnouncementColumnReadsAsBeforeWithNoAnnouncements() throws IOException {
        // the first rows of the shared chronology as it is kept there, two columns (NBER reference dates, from memory)
        RecessionCalendar plain = RecessionCalendarCsv.read(new StringReader("peak,trough\n1948-11,1949-10\n1990-07,1991-03\n"), "plain.csv");
        assertThat(plain.recessions()).containsExactly(new Recession(YearMonth.of(1948, 11), YearMonth.of(1949, 10)),
                new Recession(YearMonth.of(1990, 7), YearMonth.of(1991, 3)));
        assertThat(plain.recessions()).extracting(Recession::peakAnnounced).containsOnlyNulls();
    }

    @Test
    void anEmptyAnnouncementCellMeansNotKnown() throws IOException {
        RecessionCalendar c = RecessionCalendarCsv.read(new StringReader("peak,trough,peak_announced\n1969-12,1970-11,\n1990-07,1991-03, 1991-04-25\n"),
                "some.csv");
        assertThat(c.recessions()).extracting(Recession::peakAnnounced).containsExactly(null, LocalDate.of(1991, 4, 25));
    }
}
