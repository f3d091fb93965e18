package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.slopewatch.probability.ProbitFitException.Reason;

/**
 * Fits P(recession in month m + h) = Φ(α + β·s_m) by maximum likelihood.
 *
 * <p>Before iterating it rejects the data sets on which the likelihood has no finite maximum or
 * the answer would mean nothing: too few months, a non-finite spread, a single class, a constant
 * spread, and separation. With a single regressor separation can be decided exactly rather than
 * guessed from runaway coefficients: the MLE fails to exist exactly when some spread value c has
 * every y = 1 month on one side (≤ c) and every y = 0 month on the other (≥ c). Runaway
 * coefficients during the iterations are still caught as a second line of defence.
 */
public final class ProbitFitter {

    private final FitOptions options;

    public ProbitFitter(FitOptions options) {
        this.options = Objects.requireNonNull(options, "options");
    }

    /** Builds the sample ({@link ProbitSample#build}) with the options' horizon and fits it. */
    public ProbitFit fit(List<MonthlyAverage> months, RecessionCalendar calendar) {
        return fit(ProbitSample.build(months, calendar, options.horizonMonths()));
    }

    /**
     * @throws ProbitFitException     when the data cannot give a meaningful fit; the message says why
     * @throws IllegalArgumentException when the sample's horizon differs from the options'
     */
    public ProbitFit fit(ProbitSample sample) {
        if (sample.horizonMonths() != options.horizonMonths()) {
            throw new IllegalArgumentException("sample built for horizon " + sample.horizonMonths()
                    + " months, options say " + options.horizonMonths());
        }
        List<SampleMonth> rows = sample.rows();
        int n = rows.size();
        int needed = Math.max(options.minMonths(), options.hacLag() + 3);
        if (n < needed) {
            throw new ProbitFitException(Reason.TOO_FEW_MONTHS, "only " + n + " months with a known target"
                    + " (horizon " + options.horizonMonths() + " months); at least " + needed
                    + " are needed (minimum " + options.minMonths() + ", and Newey-West lag "
                    + options.hacLag() + " + 3)");
        }
        double[] spread = new double[n];
        boolean[] target = new boolean[n];
        List<YearMonth> monthList = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            SampleMonth r = rows.get(i);
            if (!Double.isFinite(r.spreadPct())) {
                throw new ProbitFitException(Reason.NON_FINITE_INPUT, "the spread for " + r.month() + " is "
                        + r.spreadPct() + "; every sample month needs a finite spread");
            }
            spread[i] = r.spreadPct();
            target[i] = r.recessionAhead();
            monthList.add(r.month());
        }
        int positives = sample.recessionAheadCount();
        checkClasses(n, positives);
        checkSpreadVaries(spread);
        checkSeparation(spread, target);

        double share = (double) positives / n;
        ProbitLikelihood likelihood = new ProbitLikelihood(spread, target);
        FisherScoring.Result result = FisherScoring.maximize(likelihood, Gaussian.inverseCdf(share),
                options.maxIterations(), options.tolerance());

        ProbitLikelihood.Evaluation at = result.evaluation;
        Covariance modelBased = at.inverseInformation();
        Covariance neweyWest = NeweyWest.covariance(monthList, spread, at.scoreFactor, modelBased, options.hacLag());
        // Intercept-only MLE is P = ȳ, so its log-likelihood has a closed form.
        double nullLogLik = positives * Math.log(share) + (n - positives) * Math.log1p(-share);
        return new ProbitFit(result.alpha, result.beta, modelBased, neweyWest, options.hacLag(),
                at.logLikelihood, nullLogLik, n, positives, options.horizonMonths(),
                monthList.get(0), monthList.get(n - 1), result.iterations);
    }

    private void checkClasses(int n, int positives) {
        if (positives == 0) {
            throw new ProbitFitException(Reason.SINGLE_CLASS, "none of the " + n + " months has a recession "
                    + options.horizonMonths() + " months ahead; a probit needs both outcomes (check the"
                    + " recession calendar covers the sample)");
        }
        if (positives == n) {
            throw new ProbitFitException(Reason.SINGLE_CLASS, "all " + n + " months have a recession "
                    + options.horizonMonths() + " months ahead; a probit needs both outcomes");
        }
    }

    private static void checkSpreadVaries(double[] spread) {
        for (double s : spread) {
            if (s != spread[0]) {
                return;
            }
        }
        throw new ProbitFitException(Reason.CONSTANT_SPREAD, "the spread is " + spread[0]
                + " in every month, so its effect cannot be estimated");
    }

    private static void checkSeparation(double[] spread, boolean[] target) {
        double minPos = Double.POSITIVE_INFINITY;
        double maxPos = Double.NEGATIVE_INFINITY;
        double minNeg = Double.POSITIVE_INFINITY;
        double maxNeg = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < spread.length; i++) {
            if (target[i]) {
                minPos = Math.min(minPos, spread[i]);
                maxPos = Math.max(maxPos, spread[i]);
            } else {
                minNeg = Math.min(minNeg, spread[i]);
                maxNeg = Math.max(maxNeg, spread[i]);
            }
        }
        if (maxPos <= minNeg) {
            throw separation("at most " + maxPos, "at least " + minNeg, maxPos == minNeg);
        }
        if (minPos >= maxNeg) {
            throw separation("at least " + minPos, "at most " + maxNeg, minPos == maxNeg);
        }
    }

    private static ProbitFitException separation(String recessionSide, String otherSide, boolean tied) {
        return new ProbitFitException(Reason.SEPARATION, (tied ? "quasi-" : "") + "perfect separation: every"
                + " month with a recession ahead has a spread of " + recessionSide + " pp and every other month "
                + otherSide + " pp, so the likelihood keeps rising as |beta| grows and no finite estimate"
                + " exists; use a longer sample that contains misses and false alarms");
    }
}
