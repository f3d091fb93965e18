package org.slopewatch.ingest;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.stream.IntStream;

/**
 * The soak test's quotes: snapshot messages of eleven tenors in bp, round robin over several
 * curves. Each curve quotes a business day {@code quotesPerDay} times (1: a history backfilled
 * day by day; more: intraday revisions of the same date, as a live feed sends) and then moves to
 * the next, so that the run ends on the last business day up to today. The 10Y-3M spread of each
 * curve follows its own random walk from day to day (every third curve starts near zero, so spells,
 * confirmations and notices happen), with small noise between revisions.
 */
final class SoakFeed {

    static final String[] TENORS = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};
    private static final double[] YEARS = {1 / 12.0, 0.25, 0.5, 1, 2, 3, 5, 7, 10, 20, 30};

    private final List<String> curves;
    private final double[] meanBp;
    private final double[] spreadBp;
    private final Random random;
    private final LocalDate firstDay;
    private final int quotesPerDay;
    private LocalDate day;
    private long sent;

    /**
     * @param curves       curve names, quoted in turn
     * @param messages     how many messages the run will send in all
     * @param quotesPerDay how often each curve quotes a date before moving on
     */
    SoakFeed(List<String> curves, LocalDate today, long messages, int quotesPerDay, boolean nearZero, long seed) {
        this.curves = curves;
        this.quotesPerDay = quotesPerDay;
        this.random = new Random(seed);
        this.meanBp = IntStream.range(0, curves.size()).mapToDouble(i -> nearZero && i % 3 == 0 ? 5 : 100).toArray();
        this.spreadBp = meanBp.clone();
        long days = (messages + (long) curves.size() * quotesPerDay - 1) / ((long) curves.size() * quotesPerDay);
        LocalDate d = businessDayOnOrBefore(today);
        for (long i = 1; i < days; i++) {
            d = businessDayOnOrBefore(d.minusDays(1));
        }
        this.firstDay = d;
        this.day = d;
    }

    LocalDate firstDay() {
        return firstDay;
    }

    /** A JSON array of the next {@code count} snapshots. */
    String batch(int count) {
        StringBuilder b = new StringBuilder(count * 230).append('[');
        for (int i = 0; i < count; i++) {
            int c = (int) (sent % curves.size());
            if (sent > 0 && c == 0 && (sent / curves.size()) % quotesPerDay == 0) {
                nextDay();
            }
            sent++;
            double spread = spreadBp[c] + random.nextGaussian() * 0.5;
            b.append(i == 0 ? "" : ",").append("{\"curve\":\"").append(curves.get(c)).append("\",\"date\":\"").append(day)
                    .append("\",\"unit\":\"bp\",\"yields\":{");
            for (int t = 0; t < TENORS.length; t++) {
                // 400 bp at 3M, 400 + spread at 10Y, linear in log maturity between (and beyond)
                double w = Math.log(YEARS[t] / 0.25) / Math.log(10 / 0.25);
                b.append(t == 0 ? "" : ",").append('"').append(TENORS[t]).append("\":")
                        .append(String.format(Locale.ROOT, "%.2f", 400 + spread * w + random.nextGaussian() * 0.2));
            }
            b.append("}}");
        }
        return b.append(']').toString();
    }

    private void nextDay() {
        day = nextBusinessDay(day);
        for (int c = 0; c < spreadBp.length; c++) {
            // daily steps of 4 bp pulled back by 5 % a day: about 13 bp around the mean
            spreadBp[c] += 0.05 * (meanBp[c] - spreadBp[c]) + random.nextGaussian() * 4;
        }
    }

    private static LocalDate businessDayOnOrBefore(LocalDate d) {
        while (d.getDayOfWeek() == DayOfWeek.SATURDAY || d.getDayOfWeek() == DayOfWeek.SUNDAY) {
            d = d.minusDays(1);
        }
        return d;
    }

    private static LocalDate nextBusinessDay(LocalDate d) {
        LocalDate n = d.plusDays(1);
        while (n.getDayOfWeek() == DayOfWeek.SATURDAY || n.getDayOfWeek() == DayOfWeek.SUNDAY) {
            n = n.plusDays(1);
        }
        return n;
    }
}
