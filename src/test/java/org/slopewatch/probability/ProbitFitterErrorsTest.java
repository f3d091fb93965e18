package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;
import java.util.function.IntToDoubleFunction;
import org.junit.jupiter.api.Test;
import org.slopewatch.probability.ProbitFitException.Reason;

/**
 * Data sets on which no probit maximum-likelihood estimate exists or means anything. Separation
 * follows Albert and Anderson (1984): with complete or quasi-complete separation the MLE does
 * not exist (from memory).
 */
class ProbitFitterErrorsTest {

    private static final YearMonth START = YearMonth.of(2000, 1);
    /** Recession in months 20..29 of the synthetic series (peak at month 19). */
    private static final RecessionCalendar ONE_RECESSION = new RecessionCalendar(
            List.of(new Recession(START.plusMonths(19), START.plusMonths(29))));
    private static final ProbitFitter NOWCAST = new ProbitFitter(FitOptions.horizon(0));

    private static List<MonthlyAverage> series(int count, IntToDoubleFunction spreadOfMonth) {
        List<MonthlyAverage> out = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            out.add(new MonthlyAverage(START.plusMonths(i), spreadOfMonth.applyAsDouble(i), 1));
        }
        return out;
    }

    private static boolean inRecession(int i) {
        return i >= 20 && i <= 29;
    }

    private static ProbitFitException failure(ProbitFitter fitter, List<MonthlyAverage> months, RecessionCalendar cal) {
        return catchThrowableOfType(ProbitFitException.class, () -> fitter.fit(months, cal));
    }

    @Test
    void completeSeparationIsNamed() {
        // Spread below zero exactly in the recession months, above zero elsewhere.
        ProbitFitException e = failure(NOWCAST, series(48, i -> inRecession(i) ? -1.0 - 0.01 * i : 0.5 + 0.01 * i),
                ONE_RECESSION);
        assertThat(e.reason()).isEqualTo(Reason.SEPARATION);
        assertThat(e.getMessage()).startsWith("perfect separation").contains("no finite estimate");
    }

    @Test
    void quasiSeparationWithATieAtTheBoundaryIsNamed() {
        // Recession months at -1.0 or below, all other months at -1.0 or above: one shared value.
        ProbitFitException e = failure(NOWCAST, series(48, i -> inRecession(i) ? -1.0 - 0.01 * (i - 20)
                : i == 5 ? -1.0 : 0.5), ONE_RECESSION);
        assertThat(e.reason()).isEqualTo(Reason.SEPARATION);
        assertThat(e.getMessage()).startsWith("quasi-perfect separation").contains("-1.0 pp");
    }

    @Test
    void overlappingClassesFitWithoutComplaint() {
        // Control for the two tests above: one false alarm (month 5 inverted) and one miss (month
        // 25 positive) remove the separation, and the fit converges with β < 0.
        ProbitFit fit = NOWCAST.fit(series(48, i -> (inRecession(i) && i != 25) || i == 5 ? -1.0 + 0.02 * i
                : 0.5 + 0.01 * i), ONE_RECESSION);
        assertThat(fit.beta()).isNegative();
        assertThat(fit.logLikelihood()).isGreaterThan(fit.nullLogLikelihood());
    }

    @Test
    void noRecessionAtAllIsASingleClass() {
        ProbitFitException e = failure(NOWCAST, series(48, i -> 0.01 * i), new RecessionCalendar(List.of()));
        assertThat(e.reason()).isEqualTo(Reason.SINGLE_CLASS);
        assertThat(e.getMessage()).contains("none of the 48 months has a recession");
    }

    @Test
    void recessionEverywhereIsASingleClass() {
        RecessionCalendar always = new RecessionCalendar(
                List.of(new Recession(START.minusMonths(1), START.plusMonths(100))));
        ProbitFitException e = failure(NOWCAST, series(48, i -> 0.01 * i), always);
        assertThat(e.reason()).isEqualTo(Reason.SINGLE_CLASS);
        assertThat(e.getMessage()).contains("all 48 months have a recession");
    }

    @Test
    void aNaNSpreadIsNamedWithItsMonth() {
        ProbitFitException e = failure(NOWCAST, series(48, i -> i == 7 ? Double.NaN : 0.01 * i), ONE_RECESSION);
        assertThat(e.reason()).isEqualTo(Reason.NON_FINITE_INPUT);
        assertThat(e.getMessage()).contains("2000-08").contains("NaN");
    }

    @Test
    void anInfiniteSpreadIsNamedToo() {
        ProbitFitException e = failure(NOWCAST, series(48, i -> i == 0 ? Double.NEGATIVE_INFINITY : 0.01 * i),
                ONE_RECESSION);
        assertThat(e.reason()).isEqualTo(Reason.NON_FINITE_INPUT);
        assertThat(e.getMessage()).contains("2000-01");
    }

    @Test
    void tooFewMonthsSaysHowManyAreNeeded() {
        // 30 data months, h = 12: 18 usable months, fewer than the default minimum of 24.
        ProbitFitException e = failure(new ProbitFitter(FitOptions.horizon(12)), series(30, i -> 0.01 * i),
                ONE_RECESSION);
        assertThat(e.reason()).isEqualTo(Reason.TOO_FEW_MONTHS);
        assertThat(e.getMessage()).contains("only 18 months").contains("at least 24");
    }

    @Test
    void aConstantSpreadCannotIdentifyTheSlope() {
        ProbitFitException e = failure(NOWCAST, series(48, i -> 0.25), ONE_RECESSION);
        assertThat(e.reason()).isEqualTo(Reason.CONSTANT_SPREAD);
        assertThat(e.getMessage()).contains("0.25");
    }

    @Test
    void aSampleForAnotherHorizonIsAProgrammingError() {
        ProbitSample sample = ProbitSample.build(series(48, i -> 0.01 * i), ONE_RECESSION, 6);
        assertThatThrownBy(() -> NOWCAST.fit(sample)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("horizon 6");
    }
}
