package org.slopewatch.spread;

import java.util.Optional;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.NelsonSiegelSvensson;
import org.slopewatch.curve.NssFitter;
import org.slopewatch.curve.Resolution;
import org.slopewatch.curve.Tenor;

/**
 * The near-term forward spread: the 3-month forward rate six quarters ahead (from 18 to 21
 * months), read off a Nelson–Siegel–Svensson fit of the snapshot, minus the quoted 3-month yield.
 *
 * <p>It needs the 3-month point and enough other tenors for a fit ({@link NssFitter#MIN_POINTS});
 * otherwise there is no value for the date.
 */
public record NearTermForwardSpread() implements SpreadDefinition {

    public static final String NAME = "near-term-forward";
    private static final Tenor THREE_MONTHS = Tenor.months(3);
    private static final double FORWARD_START_YEARS = 1.5;
    private static final double FORWARD_END_YEARS = 1.75;

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public double valueBp(CurveSnapshot snapshot) {
        double threeMonth = snapshot.yieldBp(THREE_MONTHS);
        if (Double.isNaN(threeMonth)) {
            return Double.NaN;
        }
        Optional<NelsonSiegelSvensson> fit = NssFitter.fit(snapshot);
        return fit.map(c -> Resolution.BASIS_POINTS.round(c.forwardRate(FORWARD_START_YEARS, FORWARD_END_YEARS) - threeMonth)).orElse(Double.NaN);
    }
}
