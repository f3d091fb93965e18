package org.slopewatch.report;

import java.time.LocalDate;

/** One plotted value of a spread, in basis points. */
public record ChartPoint(LocalDate date, double valueBp) {
}
