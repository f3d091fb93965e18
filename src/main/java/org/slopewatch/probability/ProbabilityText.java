package org.slopewatch.probability;

import java.time.temporal.ChronoUnit;
import java.util.Locale;

/**
 * A live probability in words. A percentage alone invites the reader to fill in the rest: this
 * says which spread it was read off, how far ahead it looks, which month's average went in and
 * whether that month is over, the band when there is one, and where the coefficients come from.
 * Reports use it as it is; the dashboard says the same from the API's fields.
 */
public final class ProbabilityText {

    private ProbabilityText() {
    }

    /**
     * For example {@code 12-month-ahead recession probability 23 % (90 % band 15–33 %): P(recession in 2027-10),
     * from the 10Y-3M average of 2026-10 (complete month, 21 observations); model: …}.
     *
     * @param spread the spread's name, e.g. {@code 10Y-3M}
     */
    public static String sentence(String spread, LiveProbability p) {
        StringBuilder b = new StringBuilder();
        b.append(horizonMonths(p)).append("-month-ahead recession probability ").append(percent(p.probability()));
        ProbabilityBand band = p.band();
        if (band != null) {
            b.append(String.format(Locale.ROOT, " (%.0f %% band %s\u2013%s)", 100 * band.level(), number(band.lower()), percent(band.upper())));
        } else {
            b.append(" (no band: the model has no covariance)");
        }
        b.append(": P(recession in ").append(p.targetMonth()).append("), from the ").append(spread).append(" average of ")
                .append(p.month()).append(' ').append(month(p));
        b.append("; model: ").append(p.source().isEmpty() ? "no source given" : p.source());
        return b.toString();
    }

    /** {@code (complete month, 21 observations)} or {@code so far (provisional: month to date, 9 observations)}. */
    public static String month(LiveProbability p) {
        String observations = p.observations() + (p.observations() == 1 ? " observation" : " observations");
        return p.provisional() ? "so far (provisional: month to date, " + observations + ")" : "(complete month, " + observations + ")";
    }

    /** Months from the averaged month to the month the probability is about. */
    public static long horizonMonths(LiveProbability p) {
        return ChronoUnit.MONTHS.between(p.month(), p.targetMonth());
    }

    /**
     * A probability as a whole percentage, {@code 23 %}; one decimal where whole numbers would round
     * it to 0 % or 100 %, which a model never gives.
     */
    public static String percent(double p) {
        return number(p) + " %";
    }

    private static String number(double p) {
        double pct = 100 * p;
        return String.format(Locale.ROOT, pct < 0.5 || pct >= 99.5 ? "%.1f" : "%.0f", pct);
    }
}
