package org.slopewatch.replay;

import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.slopewatch.probability.Covariance;
import org.slopewatch.probability.CovarianceKind;
import org.slopewatch.probability.MonthlyAverage;
import org.slopewatch.probability.ProbabilityBand;
import org.slopewatch.probability.ProbitFit;
import org.slopewatch.probability.Recession;
import org.slopewatch.probability.RecessionCalendar;

/**
 * A probit fit of "recession h months ahead" on a spread's monthly averages, as reported to a
 * person or a script. Field names become the JSON report's keys (snake case).
 *
 * @param recessions       where the recession dates came from
 * @param model            the fitted equation in words
 * @param target           how y_m was built
 * @param coefficients     α and β, each with both standard errors
 * @param standardErrors   which covariances the standard errors come from, and their matrices
 * @param spreadAtEvenOddsPct the spread at which the fitted P = 50 %, −α/β
 * @param bands            P with a confidence band at a grid of spreads
 * @param notes            things about the data a reader should know before using the numbers
 */
public record FitReport(String source, String curve, String spread, String recessions, int horizonMonths, String model,
                        String target, Sample sample, List<Coefficient> coefficients, StandardErrors standardErrors,
                        double logLikelihood, double nullLogLikelihood, double mcfaddenR2, double estrellaR2,
                        double spreadAtEvenOddsPct, Bands bands, int iterations, List<String> notes, String caution) {

    /** The spreads of the default band grid, in percentage points: a steep curve down to a deep inversion. */
    public static final List<Double> DEFAULT_GRID = List.of(-2.0, -1.0, 0.0, 1.0, 2.0, 3.0);
    /** The default confidence level of the bands. */
    public static final double DEFAULT_LEVEL = 0.90;

    public FitReport {
        coefficients = List.copyOf(coefficients);
        notes = List.copyOf(notes);
    }

    /**
     * The months fitted and the data they came from.
     *
     * @param firstMonth           first sample month
     * @param lastMonth            last sample month; its target is lastMonth + h
     * @param months               sample months n
     * @param recessionAheadMonths sample months with y = 1
     * @param dataMonths           calendar months with at least one observation
     * @param observations         dated spread values averaged into those months
     */
    public record Sample(YearMonth firstMonth, YearMonth lastMonth, int months, int recessionAheadMonths,
                         YearMonth dataFirstMonth, YearMonth dataLastMonth, int dataMonths, int observations) {
    }

    /** One coefficient with its standard error under each covariance. */
    public record Coefficient(String name, double estimate, double seModelBased, double seNeweyWest) {
    }

    /** Where the standard errors come from, in words, and the two covariance matrices of (α, β). */
    public record StandardErrors(String modelBased, String neweyWest, int neweyWestLagMonths,
                                 Covariance covarianceModelBased, Covariance covarianceNeweyWest) {
    }

    /** P at a few spreads with a two-sided band. */
    public record Bands(double level, String covariance, String method, List<Band> rows) {
        public Bands {
            rows = List.copyOf(rows);
        }
    }

    /** P and its band at one spread (percentage points). */
    public record Band(double spreadPct, double probability, double lower, double upper) {
    }

    /**
     * @param months       the monthly averages the sample was built from, in month order
     * @param recessions   the name of the recession-date source, for the report
     * @param bandKind     the covariance the bands rest on
     */
    public static FitReport of(SpreadSeries series, List<MonthlyAverage> months, String recessions,
                               RecessionCalendar calendar, ProbitFit fit, CovarianceKind bandKind, double level,
                               List<Double> grid) {
        Objects.requireNonNull(bandKind, "bandKind");
        int h = fit.horizonMonths();
        String model = "P(recession in month m+" + h + ") = Phi(alpha + beta * s_m), s_m = calendar-month average of "
                + series.spread() + " in percentage points";
        String target = "y_m = 1 when month m+" + h + " lies in a recession (the months after a peak through its trough, "
                + "inclusive); months whose target lies after the last data month are left out";
        int observations = months.stream().mapToInt(MonthlyAverage::count).sum();
        Sample sample = new Sample(fit.firstMonth(), fit.lastMonth(), fit.months(), fit.recessionAheadMonths(),
                months.get(0).month(), months.get(months.size() - 1).month(), months.size(), observations);
        List<Coefficient> coefficients = List.of(
                new Coefficient("alpha", fit.alpha(), fit.seAlpha(CovarianceKind.MODEL_BASED), fit.seAlpha(CovarianceKind.NEWEY_WEST)),
                new Coefficient("beta", fit.beta(), fit.seBeta(CovarianceKind.MODEL_BASED), fit.seBeta(CovarianceKind.NEWEY_WEST)));
        StandardErrors se = new StandardErrors(
                "inverse of the expected (Fisher) information at the estimate, as R's vcov() of a glm probit; it assumes"
                        + " independent months, which overlapping horizons are not",
                "Bartlett kernel, weights 1 - l/(L+1) for lags l = 0..L, L = " + fit.hacLag() + " calendar months;"
                        + " no prewhitening, no small-sample factor (as R's sandwich::NeweyWest(lag = L, prewhite = FALSE,"
                        + " adjust = FALSE))",
                fit.hacLag(), fit.modelBased(), fit.neweyWest());
        List<Band> rows = new ArrayList<>(grid.size());
        for (double s : grid) {
            ProbabilityBand b = fit.band(s, level, bandKind);
            rows.add(new Band(s, b.probability(), b.lower(), b.upper()));
        }
        Bands bands = new Bands(level, bandKind.label(), "delta method on the index alpha + beta*s, mapped through Phi", rows);
        return new FitReport(series.source(), series.curve(), series.spread(), recessions, h, model, target, sample,
                coefficients, se, fit.logLikelihood(), fit.nullLogLikelihood(), fit.mcFaddenR2(), fit.estrellaR2(),
                fit.spreadAtEvenOdds(), bands, fit.iterations(), notes(series, months, calendar, fit), ReplayReport.CAUTION);
    }

    private static List<String> notes(SpreadSeries series, List<MonthlyAverage> months, RecessionCalendar calendar, ProbitFit fit) {
        List<String> notes = new ArrayList<>();
        if (series.datesWithoutValue() > 0) {
            notes.add(series.datesWithoutValue() + " date(s) without both legs of " + series.spread()
                    + " were left out of the monthly averages");
        }
        long span = ChronoUnit.MONTHS.between(months.get(0).month(), months.get(months.size() - 1).month()) + 1;
        if (span > months.size()) {
            notes.add((span - months.size()) + " calendar month(s) inside the data have no observation; they are left out,"
                    + " not filled in");
        }
        List<Recession> dated = calendar.recessions();
        YearMonth lastTarget = fit.lastMonth().plusMonths(fit.horizonMonths());
        if (dated.isEmpty()) {
            notes.add("the recession dates list no recession");
        } else if (lastTarget.isAfter(dated.get(dated.size() - 1).trough())) {
            // a chronology is dated long after the fact: months past its last trough count as expansion
            notes.add("target months after " + dated.get(dated.size() - 1).trough() + " (the last dated trough) count as"
                    + " expansion; check that no peak has been dated since");
        }
        return notes;
    }
}
