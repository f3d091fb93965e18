package org.slopewatch.curve;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.slopewatch.text.Excerpt;

/**
 * A point on the curve: a count of weeks (bills), months or years.
 *
 * <p>Accepted: {@code 1W}–{@code 52W}, {@code 1M}–{@code 24M}, {@code 1Y}–{@code 30Y}. Anything else
 * is rejected with a message naming the value, because a silently misread tenor would put a
 * yield on the wrong leg of a spread.
 */
public record Tenor(int count, Period period) implements Comparable<Tenor> {

    /** The unit a tenor is counted in, with its length in years for ordering and fitting. */
    public enum Period {
        WEEK('W', 52, 7.0 / 365.0),
        MONTH('M', 24, 1.0 / 12.0),
        YEAR('Y', 30, 1.0);

        private final char letter;
        private final int maxCount;
        private final double years;

        Period(char letter, int maxCount, double years) {
            this.letter = letter;
            this.maxCount = maxCount;
            this.years = years;
        }
    }

    private static final Pattern SYNTAX = Pattern.compile("(\\d{1,3})([WMY])");

    public Tenor {
        if (period == Period.MONTH && count > 0 && count % 12 == 0) {
            // 12M and 1Y are one maturity: keep one spelling so that equality follows ordering
            count = count / 12;
            period = Period.YEAR;
        }
        if (period == null || count < 1 || count > period.maxCount) {
            throw new IllegalArgumentException("tenor out of range: " + count + (period == null ? "?" : period.letter)
                    + " (accepted: 1W-52W, 1M-24M, 1Y-30Y)");
        }
    }

    /** Parses {@code 3M}, {@code 10Y}, {@code 13W} (case-insensitive, surrounding blanks ignored). */
    public static Tenor parse(String text) {
        if (text == null) {
            throw new IllegalArgumentException("missing tenor");
        }
        Matcher m = SYNTAX.matcher(text.strip().toUpperCase(Locale.ROOT));
        if (!m.matches()) {
            throw new IllegalArgumentException("unknown tenor " + Excerpt.quoted(text) + " (accepted: 1W-52W, 1M-24M, 1Y-30Y)");
        }
        int count = Integer.parseInt(m.group(1));
        Period period = switch (m.group(2).charAt(0)) {
            case 'W' -> Period.WEEK;
            case 'M' -> Period.MONTH;
            default -> Period.YEAR;
        };
        if (count < 1 || count > period.maxCount) {
            throw new IllegalArgumentException("unknown tenor " + Excerpt.quoted(text) + " (accepted: 1W-52W, 1M-24M, 1Y-30Y)");
        }
        return new Tenor(count, period);
    }

    public static Tenor years(int n) {
        return new Tenor(n, Period.YEAR);
    }

    public static Tenor months(int n) {
        return new Tenor(n, Period.MONTH);
    }

    public static Tenor weeks(int n) {
        return new Tenor(n, Period.WEEK);
    }

    /** Time to maturity in years, the abscissa for interpolation and curve fitting. */
    public double years() {
        return count * period.years;
    }

    /** Calendar days to maturity as used for bill conversions (weeks exact, months and years approximate). */
    public int days() {
        return switch (period) {
            case WEEK -> count * 7;
            case MONTH -> (int) Math.round(count * 365.0 / 12.0);
            case YEAR -> count * 365;
        };
    }

    /** True for maturities of at most one year, the range in which bills are quoted on a discount basis. */
    public boolean isBillMaturity() {
        return years() <= 1.0 + 1e-9;
    }

    @Override
    public int compareTo(Tenor other) {
        int byMaturity = Double.compare(years(), other.years());
        return byMaturity != 0 ? byMaturity : period.compareTo(other.period);
    }

    @Override
    public String toString() {
        return count + String.valueOf(period.letter);
    }
}
