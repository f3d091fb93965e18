package org.slopewatch.rules;

import java.util.Locale;
import java.util.Objects;
import org.slopewatch.probability.ProbitModel;

/**
 * The recession-probability model a policy signs off for one watched spread: probit
 * coefficients with their provenance, the horizon they predict, and how the spread is averaged
 * before it goes in (the coefficients only mean something on the averaging they were fitted on).
 *
 * @param spread        the watched spread's name, e.g. {@code 10Y-3M}
 * @param model         α, β and the {@code source} note as the model's provenance
 * @param horizonMonths the model gives P(recession in month m + horizonMonths)
 */
public record SpreadProbabilityModel(String spread, ProbitModel model, int horizonMonths, Averaging average) {

    /** How the spread is averaged before the model is applied. */
    public enum Averaging {
        /** Calendar-month average of the daily values, as the published monthly probits use. */
        MONTHLY;

        /** The word used in policy files. */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    public SpreadProbabilityModel {
        Objects.requireNonNull(spread, "spread");
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(average, "average");
        if (horizonMonths < 0) {
            throw new IllegalArgumentException("horizon must be 0 or more months, got " + horizonMonths);
        }
        if (model.provenance().isEmpty()) {
            throw new IllegalArgumentException("a probability model for " + spread + " needs its source");
        }
    }
}
