package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.Objects;

/**
 * A recession probability read off one calendar month's average spread: provisional while the
 * month runs (its average can still move), final once the next month has begun.
 *
 * @param month        the month whose average went in
 * @param averageBp    that average, in basis points (the model reads percentage points)
 * @param observations how many daily values made the average
 * @param probability  P(recession in {@code targetMonth}) under the model
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
        ProbabilityBand band = covariance == null ? null : ProbabilityBand.of(model, covariance, null, spreadPct, BAND_LEVEL);
        return new LiveProbability(month, provisional, averageBp, observations, model.probability(spreadPct),
                month.plusMonths(horizonMonths), model.provenance(), band);
    }
}
