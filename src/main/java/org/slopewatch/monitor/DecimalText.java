package org.slopewatch.monitor;

import java.util.Locale;

/**
 * Numbers in reason texts written exactly as {@code String.format(Locale.ROOT, "%.1f", v)} writes
 * them (round half up, a minus sign on every negative value, {@code -0.0} included), at a small
 * fraction of the cost.
 *
 * <p>Why not {@code String.format}: a transition's reason is built when the transition happens,
 * and the formatter sets up locale symbols on every call; on a long replay that was about as costly
 * as all the monitor's other work together. The formatter rounds the shortest decimal that reads
 * back as the value (the digits of {@link Double#toString}), not the binary value itself, so the two
 * can differ only when the value lies next to a tie (…x5 in the first dropped digit). Those values,
 * and magnitudes too large for the check below to be exact, go to {@code String.format} itself.
 */
final class DecimalText {

    /** Above this magnitude the scaled value's rounding error could reach the tie margin. */
    private static final double FAST_LIMIT = 1e6;
    /** Distance from a tie (in units of the last kept digit) below which the formatter decides. */
    private static final double TIE_MARGIN = 1e-6;
    private static final long[] POWERS = {1, 10, 100, 1000};

    private DecimalText() {
    }

    /** Appends {@code value} with {@code decimals} (0 to 3) digits after the point, as {@code %.Nf} does. */
    static StringBuilder append(StringBuilder b, double value, int decimals) {
        long scale = POWERS[decimals];
        double magnitude = Math.abs(value);
        double scaled = magnitude * scale;
        double fraction = scaled - Math.floor(scaled);
        if (!(magnitude < FAST_LIMIT) || Math.abs(fraction - 0.5) < TIE_MARGIN) {
            return b.append(String.format(Locale.ROOT, "%." + decimals + "f", value));
        }
        if (Double.compare(value, 0.0) < 0) {
            b.append('-'); // as the formatter: -0.04 is written -0.0
        }
        long units = Math.round(scaled); // not near a tie, so the nearest is what half-up gives too
        b.append(units / scale);
        if (decimals > 0) {
            b.append('.');
            String digits = Long.toString(units % scale);
            for (int pad = decimals - digits.length(); pad > 0; pad--) {
                b.append('0');
            }
            b.append(digits);
        }
        return b;
    }
}
