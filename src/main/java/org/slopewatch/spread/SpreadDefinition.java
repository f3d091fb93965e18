package org.slopewatch.spread;

import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.text.Excerpt;

/**
 * How one spread is computed from a curve snapshot, in basis points.
 *
 * <p>Definitions are curve-independent ({@code 10Y-3M} means the same on every curve); the
 * monitor keys its state by curve and spread name.
 */
public sealed interface SpreadDefinition permits TermSpread, NearTermForwardSpread {

    /** The spread's name as written in policy files and reports, e.g. {@code 10Y-3M}. */
    String name();

    /** The spread in basis points to {@link org.slopewatch.curve.Resolution#BASIS_POINTS}, or NaN when the snapshot lacks what it needs. */
    double valueBp(CurveSnapshot snapshot);

    /**
     * Parses a spread name: {@code LONG-SHORT} such as {@code 10Y-3M}, optionally followed by
     * {@code ~} to allow interpolated legs ({@code 10Y-3M~}), or {@code near-term-forward}.
     */
    static SpreadDefinition parse(String text) {
        String name = text == null ? "" : text.strip();
        if (NearTermForwardSpread.NAME.equalsIgnoreCase(name)) {
            return new NearTermForwardSpread();
        }
        boolean interpolate = name.endsWith("~");
        String body = interpolate ? name.substring(0, name.length() - 1) : name;
        int dash = body.indexOf('-');
        if (dash <= 0 || dash == body.length() - 1) {
            throw new IllegalArgumentException("unknown spread " + Excerpt.quoted(text)
                    + " (expected LONG-SHORT such as 10Y-3M, or " + NearTermForwardSpread.NAME + ")");
        }
        Tenor longLeg = Tenor.parse(body.substring(0, dash));
        Tenor shortLeg = Tenor.parse(body.substring(dash + 1));
        return new TermSpread(longLeg, shortLeg, interpolate);
    }
}
