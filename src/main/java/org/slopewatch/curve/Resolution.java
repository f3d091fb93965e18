package org.slopewatch.curve;

/**
 * The one rule for decimal values: a yield, a spread or an average is taken to a stated number of
 * decimals before it is compared with a threshold or written out, and averages are worked out
 * exactly from those values.
 *
 * <p>Why: quotes are decimals (8.10 %), but binary floating point holds most of them only
 * approximately, so 8.10 % − 8.05 % computes as 4.999999999999886 bp and a rule "at or above 5 bp"
 * would miss a spread that stands exactly on it. Rounded to 10⁻⁶ bp, every spread of quotes with up
 * to eight decimals of a percent is the double nearest its exact decimal value, and two such values
 * compare as the decimals do. Sums are kept in whole units of the resolution ({@code long}), so an
 * average is exact until its one final rounding, half to even, as {@link java.math.RoundingMode#HALF_EVEN}.
 *
 * <p>A value exactly halfway between two steps is rounded to the even step; a double that lies a
 * hair off the halfway point (as a binary value of a decimal tie may) goes to the nearer step.
 */
public final class Resolution {

    /** Basis points to 10⁻⁶ bp: yields, spreads, their averages and every threshold in basis points. */
    public static final Resolution BASIS_POINTS = new Resolution(6);

    /** Numbers between 0 and 1 to 10⁻⁶: probabilities, their levels and shares of observations. */
    public static final Resolution PROBABILITY = new Resolution(6);

    private final int decimals;
    private final long scale;
    /** Magnitudes whose scaled value a double no longer holds to the unit: left as they are. */
    private final double limit;

    private Resolution(int decimals) {
        this.decimals = decimals;
        long s = 1;
        for (int i = 0; i < decimals; i++) {
            s *= 10;
        }
        this.scale = s;
        this.limit = 0x1p52 / s;
    }

    /** Digits after the decimal point. */
    public int decimals() {
        return decimals;
    }

    /** The value to the resolution: the double nearest to the nearest step. NaN and infinities stay as they are. */
    public double round(double value) {
        if (!(Math.abs(value) < limit)) {
            return value;
        }
        // the division by an exact power of ten is correctly rounded: the result is the double nearest the decimal
        return Math.rint(value * scale) / scale;
    }

    /** The value in whole steps of the resolution (for exact sums); the value must be finite and within range. */
    public long units(double value) {
        if (!(Math.abs(value) < limit)) {
            throw new IllegalArgumentException("cannot take " + value + " to " + decimals + " decimals");
        }
        return (long) Math.rint(value * scale);
    }

    /** A number of steps as a value: the double nearest the decimal. */
    public double value(long units) {
        return (double) units / scale;
    }

    /** The average of values summed in steps, to the resolution; NaN when there are none. */
    public double average(long sumUnits, long count) {
        return count == 0 ? Double.NaN : value(averageUnits(sumUnits, count));
    }

    /** Whether {@code value} is below {@code bound}, both taken to the resolution. */
    public boolean below(double value, double bound) {
        return round(value) < round(bound);
    }

    /** Whether {@code value} is above {@code bound}, both taken to the resolution. */
    public boolean above(double value, double bound) {
        return round(value) > round(bound);
    }

    /** Whether the average of values summed in steps, to the resolution, is below {@code bound} taken to it. */
    public boolean averageBelow(long sumUnits, long count, double bound) {
        return count > 0 && averageUnits(sumUnits, count) < units(bound);
    }

    /**
     * Whether {@code count} of {@code of} is at least {@code share} taken to the resolution: compared in
     * whole numbers, {@code count · 10^d ≥ share · 10^d · of}, so a share such as 0.7 of 10 is met by 7.
     */
    public boolean shareAtLeast(long count, long of, double share) {
        return of > 0 && Math.multiplyExact(count, scale) >= Math.multiplyExact(units(share), of);
    }

    /** The sum divided by the count in whole steps, half to even. */
    private static long averageUnits(long sumUnits, long count) {
        long q = Math.floorDiv(sumUnits, count);
        long twice = 2 * (sumUnits - q * count); // twice the remainder, 0 ≤ r < count
        if (twice > count || (twice == count && (q & 1) != 0)) {
            q++;
        }
        return q;
    }

    @Override
    public String toString() {
        return decimals + " decimals";
    }
}
