package org.slopewatch.rules;

import java.util.Locale;
import java.util.Objects;
import org.slopewatch.probability.Covariance;
import org.slopewatch.probability.ProbitModel;

/**
 * The recession-probability model a policy signs off for one watched spread: probit
 * coefficients with their provenance, the horizon they predict, and how the spread is averaged
 * before it goes in (the coefficients only mean something on the averaging they were fitted on).
 *
 * @param spread        the watched spread's name, e.g. {@code 10Y-3M}
 * @param model         α, β and the {@code source} note as the model's provenance
 * @param horizonMonths the model gives P(recession in month m + horizonMonths)
 * @param covariance    the coefficients' covariance, when the policy gives one (a fit does; published
 *                      coefficients often come without): it is what a confidence band rests on
 */
public record SpreadProbabilityModel(String spread, ProbitModel model, int horizonMonths, Averaging average, Covariance covariance) {

    /** How the spread is averaged before the model is applied. */
    public enum Averaging {
        /** Calendar-month average of the daily values, as the published monthly probits use. */
        MONTHLY;

        /** The word used in policy files. */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    /** A model without a covariance: probabilities come without a band. */
    public SpreadProbabilityModel(String spread, ProbitModel model, int horizonMonths, Averaging average) {
        this(spread, model, horizonMonths, average, null);
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
