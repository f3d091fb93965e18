package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.Objects;
import org.slopewatch.curve.Resolution;

/**
 * A recession probability read off one calendar month's average spread: provisional while the
 * month runs (its average can still move), final once the next month has begun.
 *
 * @param month        the month whose average went in
 * @param averageBp    that average, in basis points (the model reads percentage points)
 * @param observations how many daily values made the average
 * @param probability  P(recession in {@code targetMonth}) under the model, to {@link Resolution#PROBABILITY}
 * @param targetMonth  month + the model's horizon
 * @param band         the 90 % band from the coefficients' covariance, or null when the model has none
 */
public record LiveProbability(YearMonth month, boolean provisional, double averageBp, int observations, double probability,
                              YearMonth targetMonth, String source, ProbabilityBand band) {

    /** The confidence level of the band shown next to a live probability. */
    public static final double BAND_LEVEL = 0.90;

    public LiveProbability {
        Objects.requireNonNull(month, "month");
        Objects.requireNonNull(targetMonth, "targetMonth");
    }

    /**
     * The model applied to a monthly average given in basis points.
     *
     * @param covariance of the coefficients, or null: then no band
     */
    public static LiveProbability of(ProbitModel model, Covariance covariance, int horizonMonths, YearMonth month, double averageBp,
                                     int observations, boolean provisional) {
        double spreadPct = averageBp / 100.0;
        // the kind is not known: whoever wrote the policy chose which covariance to give
        ProbabilityBand band = covariance == null ? null : rounded(ProbabilityBand.of(model, covariance, null, spreadPct, BAND_LEVEL));
        // to the resolution a level is compared at: Φ(0) on a bound of 0.5 stays 0.5 whatever the last bit of α + β·s
        return new LiveProbability(month, provisional, averageBp, observations, Resolution.PROBABILITY.round(model.probability(spreadPct)),
                month.plusMonths(horizonMonths), model.provenance(), band);
    }

    private static ProbabilityBand rounded(ProbabilityBand b) {
        Resolution r = Resolution.PROBABILITY;
        return new ProbabilityBand(b.spreadPct(), r.round(b.probability()), r.round(b.lower()), r.round(b.upper()), b.seProbability(),
                b.level(), b.covariance());
    }
}
