package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.api.Test;

/**
 * Fits every month of real U.S. Treasury curves, 1953–1999, inverted ones included.
 *
 * <p>Source: Federal Reserve H.15 constant-maturity yields, 1Y/3Y/5Y/10Y monthly averages
 * (src/test/resources/reference/README.md for provenance). Four points per
 * month, so each fit is plain Nelson–Siegel. The check is the least-squares property: for any
 * fixed τ the betas are an ordinary linear regression on the loadings (Nelson and Siegel 1987,
 * from memory), computed here with Commons Math's OLS, independently of the fitter; the fitter's
 * optimum over τ must be at least as good as the best of those on a grid of τ inside its range
 * (τ from 1Y/1.7933 ≈ 0.56 years, where the hump loading peaks at the first quote, to 50 years).
 */
class NssFitterHistoryTest {

    private static final Tenor[] TENORS = {Tenor.years(1), Tenor.years(3), Tenor.years(5), Tenor.years(10)};
    private static final double[] TAU_GRID = {0.56, 0.6, 0.75, 1, 1.5, 2, 2.5, 3, 4, 6, 8, 12, 20, 30, 45};

    @Test
    void everyMonthIsFittedAtLeastAsWellAsAnyGridTau() throws IOException {
        List<CurveSnapshot> months = load();
        assertThat(months).as("months in the reference file").hasSize(558);
        for (CurveSnapshot month : months) {
            Optional<NssFit> fit = NssFitter.fitDetailed(month);
            assertThat(fit).as("fit for %s", month).isPresent();
            double best = Double.POSITIVE_INFINITY;
            for (double tau : TAU_GRID) {
                best = Math.min(best, regressionRmse(month, tau));
            }
            assertThat(fit.get().rmseBp()).as("RMSE for %s against the best grid τ", month)
                    .isLessThanOrEqualTo(best + 1e-6);
            // a quarter-year short of the first quote the curve must still be a plausible yield,
            // not the difference of two huge, opposite betas
            double threeMonth = fit.get().curve().zeroRate(0.25);
            assertThat(threeMonth).as("fitted 3M for %s", month)
                    .isBetween(YieldBounds.DEFAULT.minBp(), YieldBounds.DEFAULT.maxBp());
        }
    }

    /** RMSE of the ordinary least-squares Nelson–Siegel fit with τ held fixed. */
    private static double regressionRmse(CurveSnapshot month, double tau) {
        SvenssonFormula slope = SvenssonFormula.nelsonSiegel(0, 1, 0, tau);
        SvenssonFormula hump = SvenssonFormula.nelsonSiegel(0, 0, 1, tau);
        int n = month.size();
        double[] y = new double[n];
        double[][] x = new double[n][2];
        for (int i = 0; i < n; i++) {
            double t = month.tenor(i).years();
            y[i] = month.yieldBp(i);
            x[i][0] = slope.zero(t);
            x[i][1] = hump.zero(t);
        }
        OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
        ols.newSampleData(y, x);
        return Math.sqrt(ols.calculateResidualSumOfSquares() / n);
    }

    private static List<CurveSnapshot> load() throws IOException {
        List<CurveSnapshot> months = new ArrayList<>();
        try (BufferedReader in = new BufferedReader(new InputStreamReader(Objects.requireNonNull(
                NssFitterHistoryTest.class.getResourceAsStream("/reference/us-cmt-monthly-1953-1999.csv")),
                StandardCharsets.UTF_8))) {
            String header = in.readLine();
            assertThat(header).isEqualTo("date,1Y,3Y,5Y,10Y");
            for (String line = in.readLine(); line != null; line = in.readLine()) {
                String[] f = line.split(",");
                double[] bp = new double[TENORS.length];
                for (int i = 0; i < bp.length; i++) {
                    bp[i] = YieldBounds.DEFAULT.toBasisPoints(Double.parseDouble(f[i + 1]), YieldUnit.PERCENT);
                }
                months.add(CurveSnapshot.ofSorted("H15", LocalDate.parse(f[0]), TENORS, bp));
            }
        }
        return months;
    }
}
