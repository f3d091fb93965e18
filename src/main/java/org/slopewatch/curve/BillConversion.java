package org.slopewatch.curve;

/**
 * U.S. Treasury bill conversion from the bank-discount rate to the bond-equivalent
 * (coupon-equivalent) yield.
 *
 * <p>Bills are quoted as a discount from face value over a 360-day year, while notes and bonds
 * are quoted as a semiannually compounded yield over the actual year. Subtracting a discount
 * rate from a bond yield understates a spread by tens of basis points when rates are high, so
 * every bill quote is converted before it enters a snapshot.
 *
 * <p>With {@code d} the discount rate (decimal), {@code t} the days to maturity and {@code y}
 * the days in the year (365, or 366 when the year after issue contains 29 February):
 * <pre>
 * price per 100:    P = 100·(1 − d·t/360)
 * t ≤ y/2 (simple): BEY = y·d / (360 − d·t)              = (100 − P)/P · y/t
 * t &gt; y/2 (longer): solves P·(1 + (t − y/2)/y·BEY)·(1 + BEY/2) = 100, whose positive root is
 *                   BEY = [−2t/y + 2·√((t/y)² − (2t/y − 1)·(1 − 100/P))] / (2t/y − 1)
 * </pre>
 * With {@code y = 365} the switch falls between 182 and 183 days, the Treasury's half-year
 * boundary. The simple form annualises over {@code y} rather than a fixed 365 because that is
 * the limit of the longer form as {@code t} approaches {@code y/2}; it keeps the conversion
 * continuous in a 366-day year (where 183 days would otherwise divide by zero).
 *
 * <p>Rates are decimals inside; {@link #bondEquivalentBp} works in basis points, the engine's unit.
 */
public final class BillConversion {

    /** Longest bill maturity accepted: the 52-week bill runs 364 days. */
    public static final int MAX_DAYS = 364;
    public static final int DAYS_IN_YEAR = 365;
    public static final int DAYS_IN_LEAP_YEAR = 366;

    private static final double DISCOUNT_YEAR_DAYS = 360.0;
    private static final double BP_PER_UNIT = 10_000.0;

    private BillConversion() {
    }

    /** Price per 100 of face value for a discount rate (decimal) and days to maturity. */
    public static double pricePer100(double discountRate, int days) {
        checkFinite(discountRate);
        checkDays(days);
        double price = 100.0 * (1.0 - discountRate * days / DISCOUNT_YEAR_DAYS);
        if (!(price > 0)) {
            throw new IllegalArgumentException("discount rate " + discountRate + " over " + days
                    + " days gives a non-positive price per 100 (" + price + ")");
        }
        return price;
    }

    /** The bond-equivalent yield (decimal) of a discount rate (decimal), in a 365-day year. */
    public static double bondEquivalent(double discountRate, int days) {
        return bondEquivalent(discountRate, days, DAYS_IN_YEAR);
    }

    /**
     * The bond-equivalent yield (decimal) of a discount rate (decimal).
     *
     * @param daysInYear 365, or 366 when the year following the issue date contains 29 February
     */
    public static double bondEquivalent(double discountRate, int days, int daysInYear) {
        checkYear(daysInYear);
        pricePer100(discountRate, days); // validates the rate, the days and that the price is positive
        return 2 * days > daysInYear
                ? longerForm(discountRate, days, daysInYear)
                : simpleForm(discountRate, days, daysInYear);
    }

    /** {@link #bondEquivalent(double, int)} with the rate in and out in basis points. */
    public static double bondEquivalentBp(double discountBp, int days) {
        return bondEquivalentBp(discountBp, days, DAYS_IN_YEAR);
    }

    /** {@link #bondEquivalent(double, int, int)} with the rate in and out in basis points. */
    public static double bondEquivalentBp(double discountBp, int days, int daysInYear) {
        checkFinite(discountBp);
        return bondEquivalent(discountBp / BP_PER_UNIT, days, daysInYear) * BP_PER_UNIT;
    }

    /**
     * Simple interest on the price, annualised over y days: y·d / (360 − d·t), which equals
     * (100 − P)/P · y/t but avoids subtracting two nearly equal prices for short, low-rate bills.
     */
    static double simpleForm(double discountRate, int days, int daysInYear) {
        return daysInYear * discountRate / (DISCOUNT_YEAR_DAYS - discountRate * days);
    }

    /**
     * Positive root of P·(1 + (t − y/2)/y·r)·(1 + r/2) = 100: one semiannual coupon period
     * compounded, plus simple interest for the stub beyond it. Only defined for t ≠ y/2.
     * 1 − 100/P is computed as −d·t/(360 − d·t), the same quantity without the cancellation.
     * The discriminant is positive for every positive price: (t/y)² − (2t/y − 1) = (t/y − 1)² ≥ 0
     * and 1 − 100/P &lt; 1.
     */
    static double longerForm(double discountRate, int days, int daysInYear) {
        double ty = (double) days / daysInYear;
        double a = 2 * ty - 1;
        double oneMinusFaceOverPrice = -discountRate * days / (DISCOUNT_YEAR_DAYS - discountRate * days);
        double discriminant = ty * ty - a * oneMinusFaceOverPrice;
        return (-2 * ty + 2 * Math.sqrt(discriminant)) / a;
    }

    private static void checkFinite(double rate) {
        if (!Double.isFinite(rate)) {
            throw new IllegalArgumentException("discount rate is not a finite number: " + rate);
        }
    }

    private static void checkDays(int days) {
        if (days <= 0 || days > MAX_DAYS) {
            throw new IllegalArgumentException("days to maturity must be 1 to " + MAX_DAYS + " for a bill, got " + days);
        }
    }

    private static void checkYear(int daysInYear) {
        if (daysInYear != DAYS_IN_YEAR && daysInYear != DAYS_IN_LEAP_YEAR) {
            throw new IllegalArgumentException("days in year must be 365 or 366, got " + daysInYear);
        }
    }
}
