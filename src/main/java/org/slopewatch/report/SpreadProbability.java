package org.slopewatch.report;

import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.rules.ProbabilityModels;

/**
 * A spread's recession probability at the end of a report, as the daemon computes it from the
 * policy's model: from the last complete calendar month (final), and from the month so far
 * (provisional, its average can still move). Either may be missing: the data may end in their
 * first month, or the month so far may have no observation.
 *
 * @param completeMonth the last complete month's probability, or null
 * @param monthToDate   the probability from the month so far, or null
 */
public record SpreadProbability(LiveProbability completeMonth, LiveProbability monthToDate) {

    public SpreadProbability {
        if (completeMonth == null && monthToDate == null) {
            throw new IllegalArgumentException("a probability needs a complete month or a month to date");
        }
        if (completeMonth != null && completeMonth.provisional() || monthToDate != null && !monthToDate.provisional()) {
            throw new IllegalArgumentException("the complete month is final and the month to date provisional");
        }
    }

    /**
     * The policy's probabilities for a spread, computed as the daemon's API computes them, or null
     * when no model covers the spread or it has no values.
     */
    public static SpreadProbability of(ProbabilityModels models, SpreadStatus status) {
        LiveProbability complete = models.lastMonth(status).orElse(null);
        LiveProbability toDate = models.current(status).orElse(null);
        return complete == null && toDate == null ? null : new SpreadProbability(complete, toDate);
    }
}
