package org.slopewatch.rules;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.slopewatch.monitor.MonthAverages;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.probability.LiveProbability;

/**
 * The policy's probability models, by spread name. A spread without a model has no probability,
 * so no {@code probability-above} rule may refer to it.
 */
public record ProbabilityModels(Map<String, SpreadProbabilityModel> bySpread) {

    public static final ProbabilityModels NONE = new ProbabilityModels(Map.of());

    public ProbabilityModels {
        // keep the file's order for reports, and make it unmodifiable
        bySpread = Collections.unmodifiableMap(new LinkedHashMap<>(bySpread));
        bySpread.forEach((name, m) -> {
            if (!name.equals(m.spread())) {
                throw new IllegalArgumentException("model for " + m.spread() + " filed under " + name);
            }
        });
    }

    public Optional<SpreadProbabilityModel> forSpread(String spread) {
        return Optional.ofNullable(bySpread.get(spread));
    }

    public Set<String> spreads() {
        return bySpread.keySet();
    }

    public int size() {
        return bySpread.size();
    }

    /** The probability from the spread's month so far (provisional), or empty without a model or data. */
    public Optional<LiveProbability> current(SpreadStatus status) {
        MonthAverages m = status.months();
        if (m.month() == null || m.observations() == 0) {
            return Optional.empty();
        }
        return forSpread(status.spread()).map(model -> LiveProbability.of(model.model(), model.covariance(), model.horizonMonths(), m.month(), m.averageBp(),
                m.observations(), true));
    }

    /** The probability from the last complete month (final), or empty without a model or data for it. */
    public Optional<LiveProbability> lastMonth(SpreadStatus status) {
        MonthAverages m = status.months();
        if (m.month() == null || m.previousObservations() == 0) {
            return Optional.empty();
        }
        return forSpread(status.spread()).map(model -> LiveProbability.of(model.model(), model.covariance(), model.horizonMonths(), m.month().minusMonths(1),
                m.previousAverageBp(), m.previousObservations(), false));
    }

    /**
     * The probability a notice states: the last complete month's (final), or the month so far
     * (provisional, and said to be) while no month is complete yet.
     */
    public Optional<LiveProbability> stated(SpreadStatus status) {
        return lastMonth(status).or(() -> current(status));
    }

    /**
     * The probability a rule reads: a {@code probability-above} rule's month (the last complete
     * one unless it asks for the month so far), with no fallback, so that it never triggers on a
     * part of a month unasked; for any other rule, the last complete month's.
     */
    public Optional<LiveProbability> read(AlertTrigger when, SpreadStatus status) {
        boolean toDate = when instanceof AlertTrigger.ProbabilityAbove p && p.month() == ProbabilityMonth.TO_DATE;
        return toDate ? current(status) : lastMonth(status);
    }

    /** The probability a notice of a rule states: the one a probability rule read, for any other rule {@link #stated}. */
    public Optional<LiveProbability> quoted(AlertTrigger when, SpreadStatus status) {
        return when instanceof AlertTrigger.ProbabilityAbove ? read(when, status) : stated(status);
    }
}
