package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;

/**
 * The rows a probit fit runs on: for each month m with a spread, the target y_m = 1 when month
 * m + h is in recession.
 *
 * <p>Which months are kept: month m is in the sample only when m + h is no later than the last
 * month with a spread. Months whose target lies after that are dropped even when the calendar
 * reaches further, so the sample depends only on the spread series and the horizon, not on how
 * far the chronology happens to extend. The rule does not guard against an incomplete
 * chronology: the dating committee announces a peak many months after the fact, so a fit that
 * reaches the present should end its spread series where the chronology is known to be
 * complete. The R reference script (src/test/reference/probit/probit_reference.R) builds its
 * sample by the same two rules (the recession convention of {@link Recession#contains} and
 * this drop rule); keep them in step.
 *
 * @param rows          in strictly increasing month order; gaps are allowed
 * @param horizonMonths h ≥ 0 (0 asks whether the month itself is in recession)
 */
public record ProbitSample(List<SampleMonth> rows, int horizonMonths) {

    public ProbitSample {
        rows = List.copyOf(rows);
        if (horizonMonths < 0) {
            throw new IllegalArgumentException("horizon must be 0 or more months, got " + horizonMonths);
        }
        for (int i = 1; i < rows.size(); i++) {
            if (!rows.get(i).month().isAfter(rows.get(i - 1).month())) {
                throw new IllegalArgumentException("sample months must be strictly increasing: "
                        + rows.get(i).month() + " follows " + rows.get(i - 1).month());
            }
        }
    }

    /** Builds the sample from monthly averages (in month order) and a recession calendar. */
    public static ProbitSample build(List<MonthlyAverage> months, RecessionCalendar calendar, int horizonMonths) {
        if (months.isEmpty()) {
            return new ProbitSample(List.of(), horizonMonths);
        }
        for (int i = 1; i < months.size(); i++) {
            if (!months.get(i).month().isAfter(months.get(i - 1).month())) {
                throw new IllegalArgumentException("monthly averages must be in strictly increasing month order: "
                        + months.get(i).month() + " follows " + months.get(i - 1).month());
            }
        }
        YearMonth lastDataMonth = months.get(months.size() - 1).month();
        List<SampleMonth> rows = new ArrayList<>(months.size());
        for (MonthlyAverage m : months) {
            YearMonth target = m.month().plusMonths(horizonMonths);
            if (target.isAfter(lastDataMonth)) {
                break; // months are in order, so every later month is dropped too
            }
            rows.add(new SampleMonth(m.month(), m.averagePct(), calendar.inRecession(target)));
        }
        return new ProbitSample(rows, horizonMonths);
    }

    public int size() {
        return rows.size();
    }

    /** Number of rows with y = 1. */
    public int recessionAheadCount() {
        int count = 0;
        for (SampleMonth r : rows) {
            if (r.recessionAhead()) {
                count++;
            }
        }
        return count;
    }
}
