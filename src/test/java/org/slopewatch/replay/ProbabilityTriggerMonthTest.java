package org.slopewatch.replay;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.rules.PolicyException;

/**
 * {@code probability-above} on invented GOVT-A histories, run through the policy's own rule engine
 * ({@link WhatIf}, which evaluates the rules after each quote as the daemon does).
 *
 * <p>The model, P = Φ(α + β·s) with α = −0.8 and β = −2 per percentage point, is invented so that
 * P = 0.5 exactly at a monthly average s of −40 bp (−0.8 + 2·0.4 = 0); the rule's level is 0.5.
 * Reference: decimal arithmetic, {@link BigDecimal} on the quoted decimal strings, for each month's
 * average and its index α + β·s; since Φ is increasing and Φ(0) = 0.5, P is above 0.5 exactly when the
 * index is above 0. The expected date of a notice is worked out from that: the first business day
 * after a complete month whose index is above 0 (the default), or the first day whose month so far
 * has one (with {@code month: to-date}), as {@code alert-rules/README.md} defines the trigger.
 */
class ProbabilityTriggerMonthTest {

    private static final String POLICY = """
            watch:
              - spread: 10Y-3M
                confirm:
                  - days-inverted: { days: 90 }
            probability:
              10Y-3M:
                alpha: -0.8
                beta: -2
                horizon-months: 12
                source: invented for a test, P = 0.5 at a monthly average of -40 bp
            alerts:
              - name: recession-odds
                when: { probability-above: %s }
                severity: warning
                channels: [log]
            """;

    private static final BigDecimal ALPHA = new BigDecimal("-0.8");
    private static final BigDecimal BETA = new BigDecimal("-2");

    /** A day's legs in percent, as quoted. */
    record Day(LocalDate date, String tenYear, String threeMonth) {
        BigDecimal spreadBp() {
            return new BigDecimal(tenYear).subtract(new BigDecimal(threeMonth)).movePointRight(2);
        }
    }

    @Test
    void aMonthWhoseFirstDayAloneCrossesTheBoundFiresNothingWhileItsLastCompleteMonthDoesNot() throws PolicyException {
        // February 2026 at -30 bp every business day (P = Φ(-0.2) ≈ 0.42); on 2 March, the first business day of March,
        // -60 bp (alone, Φ(0.4) ≈ 0.66): March so far crosses the level, February, the last complete month, does not
        List<Day> days = new ArrayList<>(month(YearMonth.of(2026, 2), d -> new String[] {"4.20", "4.50"}));
        days.add(new Day(LocalDate.of(2026, 3, 2), "3.90", "4.50"));
        assertThat(index(average(days, YearMonth.of(2026, 2)))).isNegative();
        assertThat(index(average(days, YearMonth.of(2026, 3)))).isPositive();

        assertThat(notices(run("0.5", days))).as("the last complete month, February, is below the level: no notice").isEmpty();
        assertThat(notices(run("0.5", days))).isEqualTo(expected(days, false));
        assertThat(notices(run("{ level: 0.5, month: complete }", days))).isEmpty();
        // asked for explicitly, the month so far fires on its first day
        assertThat(notices(run("{ level: 0.5, month: to-date }", days))).containsExactly(LocalDate.of(2026, 3, 2))
                .isEqualTo(expected(days, true));
    }

    @Test
    void aCompleteMonthAboveTheLevelFiresOnTheFirstDayAfterIt() throws PolicyException {
        // February at -30 bp, March at -60 bp throughout, then 1 April: March, complete, is above the level
        List<Day> days = new ArrayList<>(month(YearMonth.of(2026, 2), d -> new String[] {"4.20", "4.50"}));
        days.addAll(month(YearMonth.of(2026, 3), d -> new String[] {"3.90", "4.50"}));
        days.add(new Day(LocalDate.of(2026, 4, 1), "3.90", "4.50"));

        assertThat(notices(run("0.5", days))).containsExactly(LocalDate.of(2026, 4, 1)).isEqualTo(expected(days, false));
        assertThat(notices(run("{ level: 0.5, month: to-date }", days))).containsExactly(LocalDate.of(2026, 3, 2))
                .isEqualTo(expected(days, true));
    }

    @Test
    void aMonthAveragingExactlyOnTheBoundIsNotAboveIt() throws PolicyException {
        // January at exactly -40 bp every day (1.13 - 1.53: binary arithmetic makes it -40.000000000000014), so P = Φ(0) = 0.5,
        // not above 0.5; then February at -40.01 bp (1.13 - 1.5301): index 0.0002, above
        List<Day> days = new ArrayList<>(month(YearMonth.of(2026, 1), d -> new String[] {"1.13", "1.53"}));
        days.addAll(month(YearMonth.of(2026, 2), d -> new String[] {"1.13", "1.5301"}));
        days.add(new Day(LocalDate.of(2026, 3, 2), "1.13", "1.53"));
        assertThat(index(average(days, YearMonth.of(2026, 1)))).isZero();
        assertThat(index(average(days, YearMonth.of(2026, 2)))).isPositive();

        assertThat(notices(run("0.5", days))).containsExactly(LocalDate.of(2026, 3, 2)).isEqualTo(expected(days, false));
        assertThat(notices(run("{ level: 0.5, month: to-date }", days))).containsExactly(LocalDate.of(2026, 2, 2))
                .isEqualTo(expected(days, true));
    }

    // --- the run, and the reference ---

    private static WhatIfReport run(String trigger, List<Day> days) throws PolicyException {
        WhatIf w = new WhatIf(CandidatePolicy.parse("odds.yaml", POLICY.formatted(trigger).getBytes(StandardCharsets.UTF_8)), SpreadFilter.ALL);
        for (Day d : days) {
            // the quoted decimals as a feed's JSON numbers are read, then to bp
            w.quote("GOVT-A", d.date(), Map.of(Tenor.parse("10Y"), bp(d.tenYear()), Tenor.parse("3M"), bp(d.threeMonth())));
        }
        return w.report("invented history", null);
    }

    private static double bp(String percent) {
        return YieldBounds.DEFAULT.toBasisPoints(Double.parseDouble(percent), YieldUnit.PERCENT);
    }

    /** The market dates of the rule's first notices (it has no resolve notice). */
    private static List<LocalDate> notices(WhatIfReport r) {
        return r.wouldFire().stream().filter(n -> n.rule().equals("recession-odds")).map(WhatIfReport.Notice::marketDate).toList();
    }

    /**
     * The notices the trigger's definition gives: for each day, the month read (the day's own month so far,
     * or the last complete month, the one before), and a notice on the first day its index is above 0;
     * a rule that stops holding and holds again would notice again, which these histories never do.
     */
    private static List<LocalDate> expected(List<Day> days, boolean toDate) {
        List<LocalDate> out = new ArrayList<>();
        boolean holding = false;
        for (int i = 0; i < days.size(); i++) {
            List<Day> seen = days.subList(0, i + 1);
            YearMonth read = toDate ? YearMonth.from(days.get(i).date()) : YearMonth.from(days.get(i).date()).minusMonths(1);
            BigDecimal average = average(seen, read);
            boolean holds = average != null && index(average).signum() > 0;
            if (holds && !holding) {
                out.add(days.get(i).date());
            }
            holding = holds;
        }
        return out;
    }

    /** The exact average in bp of the days of {@code month}, or null without any. */
    private static BigDecimal average(List<Day> days, YearMonth month) {
        List<BigDecimal> values = days.stream().filter(d -> YearMonth.from(d.date()).equals(month)).map(Day::spreadBp).toList();
        if (values.isEmpty()) {
            return null;
        }
        return values.stream().reduce(BigDecimal.ZERO, BigDecimal::add).divide(BigDecimal.valueOf(values.size()), MathContext.DECIMAL128);
    }

    /** α + β·s with s in percentage points, exactly. */
    private static BigDecimal index(BigDecimal averageBp) {
        return ALPHA.add(BETA.multiply(averageBp.movePointLeft(2)));
    }

    /** Every business day of a month, with the legs {@code legs} gives. */
    private static List<Day> month(YearMonth month, Function<LocalDate, String[]> legs) {
        Map<LocalDate, String[]> out = new LinkedHashMap<>();
        for (LocalDate d = month.atDay(1); !d.isAfter(month.atEndOfMonth()); d = d.plusDays(1)) {
            if (d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY) {
                out.put(d, legs.apply(d));
            }
        }
        return out.entrySet().stream().map(e -> new Day(e.getKey(), e.getValue()[0], e.getValue()[1])).toList();
    }
}
