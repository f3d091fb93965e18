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
 */
public record LiveProbability(YearMonth month, boolean provisional, double averageBp, int observations, double probability,
                              YearMonth targetMonth, String source) {

    public LiveProbability {
        Objects.requireNonNull(month, "month");
        Objects.requireNonNull(targetMonth, "targetMonth");
    }

    /** The model applied to a monthly average given in basis points. */
    public static LiveProbability of(ProbitModel model, int horizonMonths, YearMonth month, double averageBp, int observations,
                                     boolean provisional) {
        double p = model.probability(averageBp / 100.0);
        return new LiveProbability(month, provisional, averageBp, observations, p, month.plusMonths(horizonMonths), model.provenance());
    }
}
