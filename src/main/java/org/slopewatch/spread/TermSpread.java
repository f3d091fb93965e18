package org.slopewatch.spread;

import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;

/**
 * Long leg minus short leg of one curve, in basis points.
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
        if (interpolate) {
            return snapshot.interpolatedBp(longLeg) - snapshot.interpolatedBp(shortLeg);
        }
        return snapshot.yieldBp(longLeg) - snapshot.yieldBp(shortLeg);
    }
}
