package org.slopewatch.spread;

import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Resolution;
import org.slopewatch.curve.Tenor;

/**
 * Long leg minus short leg of one curve, in basis points to {@link Resolution#BASIS_POINTS}.
 *
 * @param interpolate when true a missing leg is filled linearly between quoted neighbours;
 *                    when false both legs must be quoted on the date
 */
public record TermSpread(Tenor longLeg, Tenor shortLeg, boolean interpolate) implements SpreadDefinition {

    public TermSpread {
        if (longLeg.compareTo(shortLeg) <= 0) {
            throw new IllegalArgumentException("a term spread's long leg must be longer than its short leg: "
                    + longLeg + "-" + shortLeg);
        }
    }

    @Override
    public String name() {
        return longLeg + "-" + shortLeg + (interpolate ? "~" : "");
    }

    @Override
    public double valueBp(CurveSnapshot snapshot) {
        // the difference of two legs on the resolution's grid is not always on it in binary (8.10 % − 8.05 %)
        if (interpolate) {
            return Resolution.BASIS_POINTS.round(snapshot.interpolatedBp(longLeg) - snapshot.interpolatedBp(shortLeg));
        }
        return Resolution.BASIS_POINTS.round(snapshot.yieldBp(longLeg) - snapshot.yieldBp(shortLeg));
    }
}
