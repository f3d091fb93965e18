package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Averages dated spread observations by calendar month, as the probit literature does: each
 * observation weighs the same, whatever the day. Months without observations are absent from
 * the result, not filled in, so a gap stays visible to the caller.
 */
public final class MonthlyAverager {

    private MonthlyAverager() {
    }

    /**
     * Calendar-month averages in month order.
     *
     * @throws IllegalArgumentException naming the date when a spread is NaN or infinite: a
     *                                  missing leg must be dropped before averaging, not averaged in
     */
    public static List<MonthlyAverage> average(Collection<SpreadObservation> observations) {
        Map<YearMonth, double[]> sums = new TreeMap<>();
        for (SpreadObservation o : observations) {
            if (!Double.isFinite(o.spreadPct())) {
                throw new IllegalArgumentException("spread on " + o.date() + " is " + o.spreadPct()
                        + "; drop dates without a value before averaging");
            }
            double[] acc = sums.computeIfAbsent(YearMonth.from(o.date()), m -> new double[2]);
            acc[0] += o.spreadPct();
            acc[1] += 1.0;
        }
        List<MonthlyAverage> out = new ArrayList<>(sums.size());
        sums.forEach((month, acc) -> out.add(new MonthlyAverage(month, acc[0] / acc[1], (int) acc[1])));
        return List.copyOf(out);
    }
}
