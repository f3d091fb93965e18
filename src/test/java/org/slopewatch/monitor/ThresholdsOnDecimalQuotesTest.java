package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.spread.SpreadDefinition;

/**
 * Spreads that stand exactly on a threshold, computed from quotes in percent as a feed sends them
 * (the quoted decimal through {@link YieldBounds#toBasisPoints}, a snapshot, the signal engine).
 *
 * <p>Reference: decimal arithmetic, {@link java.math.BigDecimal} on the quoted decimal strings. Each
 * expected spread, average and share below is worked out with BigDecimal from the same strings the
 * engine is fed, and the expected date is the first one on which that exact value meets the rule's
 * definition in {@code alert-rules/README.md} (a spell starts below {@code enter-below-bp}, ends at or
 * above {@code exit-at-or-above-bp}, a test's average must be below its {@code below-bp}, a share at
 * least {@code share}). The legs are chosen among those whose difference binary floating point gets
 * wrong: 8.10 − 8.05 computes as 4.999999999999886 bp, 1.00 − 1.10 as −10.000000000000014 bp.
 */
class ThresholdsOnDecimalQuotesTest {

    private static final Tenor TEN_YEARS = Tenor.parse("10Y");
    private static final Tenor THREE_MONTHS = Tenor.parse("3M");

    /** One day's quotes of GOVT-A in percent, as written. */
    record Day(LocalDate date, String tenYear, String threeMonth) {

        /** 10Y − 3M in basis points, exactly. */
        BigDecimal spreadBp() {
            return new BigDecimal(tenYear).subtract(new BigDecimal(threeMonth)).movePointRight(2);
        }
    }

    @Test
    void aSpreadExactlyOnTheExitThresholdEndsTheSpellThatDay() {
        // +5 bp from 8.10 and 8.05, and from 1.13 and 1.08: at or above an exit at 5 bp
        List<Day> days = days(LocalDate.of(2026, 3, 2), new String[][] {{"8.00", "8.10"}, {"8.10", "8.05"}, {"1.13", "1.08"},
                {"8.20", "8.05"}});
        assertThat(days.get(1).spreadBp()).isEqualByComparingTo("5");
        List<Transition> t = run(rules(0, 5, 1, new DaysInverted(90)), days);

        LocalDate ends = first(days, 1, d -> d.spreadBp().compareTo(BigDecimal.valueOf(5)) >= 0);
        assertThat(ends).isEqualTo(days.get(1).date());
        assertThat(t).extracting(x -> x.date() + " " + x.to())
                .as("the spell ends on the first day at or above +5 bp, which 8.10 % − 8.05 % is exactly")
                .containsExactly(days.get(0).date() + " INVERTED", ends + " NORMAL");
        assertThat(t.get(1).evidence().valueBp()).isEqualTo(days.get(1).spreadBp().doubleValue());
    }

    @Test
    void aSpreadExactlyOnTheEntryThresholdStartsNoSpell() {
        // −10 bp exactly, from four pairs of legs, then −10.5 bp: only that one is below −10
        List<Day> days = days(LocalDate.of(2026, 3, 2), new String[][] {{"1.00", "1.10"}, {"1.01", "1.11"}, {"2.01", "2.11"},
                {"1.13", "1.23"}, {"1.000", "1.105"}});
        List<Transition> t = run(rules(-10, -10, 1, new DaysInverted(90)), days);

        LocalDate starts = first(days, 0, d -> d.spreadBp().compareTo(BigDecimal.valueOf(-10)) < 0);
        assertThat(starts).isEqualTo(days.get(4).date());
        assertThat(t).extracting(x -> x.date() + " " + x.to()).containsExactly(starts + " INVERTED");
        assertThat(t.get(0).evidence().valueBp()).isEqualTo(-10.5);
    }

    @Test
    void aQuarterAveragingExactlyOnTheBoundDoesNotConfirm() {
        // every business day of 2026Q1 at exactly −10 bp (legs rotating among four pairs), then April at −10 bp
        String[][] pairs = {{"1.00", "1.10"}, {"1.14", "1.24"}, {"2.03", "2.13"}, {"2.08", "2.18"}};
        List<Day> days = rotating(LocalDate.of(2026, 1, 1), LocalDate.of(2026, 4, 3), pairs);
        List<Transition> t = run(rules(0, 0, 1, new QuarterAverage(-10)), days);

        BigDecimal q1 = average(days.stream().filter(d -> d.date().isBefore(LocalDate.of(2026, 4, 1))).map(Day::spreadBp).toList());
        assertThat(q1).as("2026Q1's exact average").isEqualByComparingTo("-10");
        assertThat(t).extracting(x -> x.date() + " " + x.to()).as("an average equal to the bound is not below it")
                .containsExactly(days.get(0).date() + " INVERTED");
    }

    @Test
    void aQuarterAverageJustBelowTheBoundConfirms() {
        // the same quarter with one day at −10.01 bp (1.00 − 1.1001): the exact average is below −10 by 0.01 bp over the quarter's days
        String[][] pairs = {{"1.00", "1.10"}, {"1.14", "1.24"}, {"2.03", "2.13"}, {"2.08", "2.18"}};
        List<Day> days = new ArrayList<>(rotating(LocalDate.of(2026, 1, 1), LocalDate.of(2026, 4, 3), pairs));
        days.set(5, new Day(days.get(5).date(), "1.00", "1.1001"));
        List<Transition> t = run(rules(0, 0, 1, new QuarterAverage(-10)), days);

        List<BigDecimal> quarter = days.stream().filter(d -> d.date().isBefore(LocalDate.of(2026, 4, 1))).map(Day::spreadBp).toList();
        assertThat(average(quarter)).isLessThan(BigDecimal.valueOf(-10));
        assertThat(t).extracting(x -> x.date() + " " + x.to())
                .containsExactly(days.get(0).date() + " INVERTED", "2026-04-01 CONFIRMED");
    }

    @Test
    void aRollingAverageExactlyOnTheBoundDoesNotConfirmUntilItIsBelow() {
        // three weeks of business days at exactly −10 bp, then −11 bp: the 14-day window's average is below −10 only from that day
        String[][] pairs = {{"1.00", "1.10"}, {"1.01", "1.11"}, {"1.15", "1.25"}, {"2.05", "2.15"}, {"2.07", "2.17"}};
        List<Day> days = new ArrayList<>(rotating(LocalDate.of(2026, 3, 2), LocalDate.of(2026, 3, 20), pairs));
        days.add(new Day(LocalDate.of(2026, 3, 23), "1.00", "1.11"));
        List<Transition> t = run(rules(0, 0, 1, new RollingAverage(14, -10)), days);

        LocalDate first = days.get(0).date();
        LocalDate confirms = null;
        for (Day d : days) {
            List<BigDecimal> window = days.stream().filter(w -> !w.date().isAfter(d.date()) && w.date().isAfter(d.date().minusDays(14)))
                    .map(Day::spreadBp).toList();
            boolean whole = d.date().toEpochDay() - first.toEpochDay() + 1 >= 14;
            if (whole && average(window).compareTo(BigDecimal.valueOf(-10)) < 0) {
                confirms = d.date();
                break;
            }
        }
        assertThat(confirms).isEqualTo(LocalDate.of(2026, 3, 23));
        assertThat(t).extracting(x -> x.date() + " " + x.to()).containsExactly(first + " INVERTED", confirms + " CONFIRMED");
    }

    @Test
    void aShareExactlyOnTheBoundConfirmsAndDaysOnTheEntryThresholdDoNotCount() {
        // entry −10: days at exactly −10 bp are not inverted; −12 bp days are. Over a 4-day window with share 0.5,
        // Thu..Fri..Mon..Tue: the window of 2026-03-06 holds 2 of 4 inverted days
        List<Day> days = days(LocalDate.of(2026, 3, 2), new String[][] {{"1.00", "1.10"}, {"1.01", "1.11"}, {"1.00", "1.12"},
                {"1.13", "1.23"}, {"1.00", "1.12"}, {"1.00", "1.12"}});
        List<Transition> t = run(rules(-10, 0, 1, new ShareInverted(4, 0.5)), days);

        LocalDate first = days.get(0).date();
        LocalDate starts = first(days, 0, d -> d.spreadBp().compareTo(BigDecimal.valueOf(-10)) < 0);
        LocalDate confirms = null;
        for (Day d : days) {
            List<Day> window = days.stream().filter(w -> !w.date().isAfter(d.date()) && w.date().isAfter(d.date().minusDays(4))).toList();
            long below = window.stream().filter(w -> w.spreadBp().compareTo(BigDecimal.valueOf(-10)) < 0).count();
            boolean whole = d.date().toEpochDay() - first.toEpochDay() + 1 >= 4;
            // share ≥ 0.5 exactly: below / n ≥ 1/2
            if (whole && !d.date().isBefore(starts) && BigDecimal.valueOf(below).divide(BigDecimal.valueOf(window.size()), MathContext.DECIMAL128)
                    .compareTo(new BigDecimal("0.5")) >= 0) {
                confirms = d.date();
                break;
            }
        }
        assertThat(starts).isEqualTo(LocalDate.of(2026, 3, 4));
        assertThat(confirms).as("2 of the 4 observations from 2026-03-03 to 2026-03-06").isEqualTo(LocalDate.of(2026, 3, 6));
        assertThat(t).extracting(x -> x.date() + " " + x.to()).containsExactly(starts + " INVERTED", confirms + " CONFIRMED");
        assertThat(t.get(1).evidence().measured()).isEqualTo(0.5);
    }

    @Test
    void valuesAndAveragesAreTheDecimalsTheQuotesMake() {
        // 93.8 bp and −40 bp, and their quarter-to-date average 26.9 bp, as BigDecimal works them out
        List<Day> days = days(LocalDate.of(2026, 3, 2), new String[][] {{"4.718", "3.780"}, {"1.13", "1.53"}});
        SignalEngine engine = engine(rules(-50, -50, 1, new DaysInverted(90)));
        for (int i = 0; i < days.size(); i++) {
            engine.onSnapshot(snapshot(days.get(i)), i + 1);
        }
        MonitorState s = engine.tracks().get(0).state();
        assertThat(days.get(0).spreadBp()).isEqualByComparingTo("93.8");
        assertThat(s.lastValueBp()).isEqualTo(days.get(1).spreadBp().doubleValue()).isEqualTo(-40.0);
        assertThat(s.quarterToDateAverageBp()).isEqualTo(average(days.stream().map(Day::spreadBp).toList()).doubleValue()).isEqualTo(26.9);
        assertThat(engine.tracks().get(0).valueBp(0)).isEqualTo(93.8);
    }

    // --- the engine as the daemon drives it, and the days ---

    private static MonitorDefinition rules(double entry, double exit, int exitObservations, PersistenceTest test) {
        return new MonitorDefinition(entry, exit, exitObservations, 365, List.of(test));
    }

    private static SignalEngine engine(MonitorDefinition rules) {
        return new SignalEngine(List.of(new Watch(SpreadDefinition.parse("10Y-3M"), rules, Set.of())));
    }

    private static CurveSnapshot snapshot(Day d) {
        // the quoted decimals as a feed's JSON numbers are read (Jackson gives Double.parseDouble's value), then to bp
        double tenYear = YieldBounds.DEFAULT.toBasisPoints(Double.parseDouble(d.tenYear()), YieldUnit.PERCENT);
        double threeMonth = YieldBounds.DEFAULT.toBasisPoints(Double.parseDouble(d.threeMonth()), YieldUnit.PERCENT);
        return CurveSnapshot.of("GOVT-A", d.date(), Map.of(TEN_YEARS, tenYear, THREE_MONTHS, threeMonth));
    }

    private static List<Transition> run(MonitorDefinition rules, List<Day> days) {
        SignalEngine engine = engine(rules);
        List<Transition> out = new ArrayList<>();
        for (int i = 0; i < days.size(); i++) {
            for (MonitorEvent e : engine.onSnapshot(snapshot(days.get(i)), i + 1)) {
                if (e instanceof Transition t) {
                    out.add(t);
                }
            }
        }
        return out;
    }

    /** Consecutive business days from {@code start}, one per pair of legs (10Y, 3M). */
    private static List<Day> days(LocalDate start, String[][] legs) {
        List<Day> out = new ArrayList<>();
        LocalDate d = businessDay(start);
        for (String[] l : legs) {
            out.add(new Day(d, l[0], l[1]));
            d = businessDay(d.plusDays(1));
        }
        return out;
    }

    /** Every business day from {@code from} to {@code to}, the legs taken from {@code pairs} in turn. */
    private static List<Day> rotating(LocalDate from, LocalDate to, String[][] pairs) {
        List<Day> out = new ArrayList<>();
        for (LocalDate d = businessDay(from); !d.isAfter(to); d = businessDay(d.plusDays(1))) {
            String[] l = pairs[out.size() % pairs.length];
            out.add(new Day(d, l[0], l[1]));
        }
        return out;
    }

    private static LocalDate businessDay(LocalDate d) {
        while (d.getDayOfWeek() == DayOfWeek.SATURDAY || d.getDayOfWeek() == DayOfWeek.SUNDAY) {
            d = d.plusDays(1);
        }
        return d;
    }

    /** The date of the first day from index {@code from} on that meets {@code rule}, or null. */
    private static LocalDate first(List<Day> days, int from, java.util.function.Predicate<Day> rule) {
        return days.subList(from, days.size()).stream().filter(rule).map(Day::date).findFirst().orElse(null);
    }

    private static BigDecimal average(List<BigDecimal> values) {
        return values.stream().reduce(BigDecimal.ZERO, BigDecimal::add).divide(BigDecimal.valueOf(values.size()), MathContext.DECIMAL128);
    }
}
