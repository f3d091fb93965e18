package org.slopewatch.ingest.demo;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Objects;
import java.util.Random;
import java.util.Spliterator;
import java.util.Spliterators;
import java.util.stream.Stream;
import java.util.stream.StreamSupport;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;

/**
 * The built-in demo feed: invented curves simulated day by day from a seed and a start date, one
 * snapshot per curve per business day (Monday to Friday; the scenario knows no holidays).
 *
 * <p>Each curve's factors start at zero on the first business day on or after the start date and
 * are stepped exactly over the calendar days to the next business day ({@link TwoFactorModel#step}).
 * A day's yields are the model's zero yields at {@link #TENORS}, converted to a bond-equivalent
 * basis ({@link BondEquivalent}), plus independent quote noise, rounded to 0.1 bp. The sequence
 * never ends: once a curve's policy script is over its gap stays flat and the factors keep
 * fluctuating around a normal curve.
 *
 * <p>Deterministic: the same seed, start and curves give the same days, bit for bit, on any JVM
 * ({@link Random}'s algorithms are specified and the model computes with {@link StrictMath}).
 * Each curve draws from its own stream, derived from the seed and the curve's name. Nothing here
 * reads a clock; pacing the feed is the caller's job. The scenario is immutable; each iterator is
 * an independent run from the start.
 */
public final class DemoScenario implements Iterable<DemoDay> {

    /** The quoted tenors, in maturity order. */
    public static final List<Tenor> TENORS = List.of(Tenor.months(1), Tenor.months(3), Tenor.months(6), Tenor.years(1),
            Tenor.years(2), Tenor.years(3), Tenor.years(5), Tenor.years(7), Tenor.years(10), Tenor.years(20),
            Tenor.years(30));

    private static final double DAYS_PER_YEAR = 365.0;
    private static final double BP = 10_000.0;

    private final long seed;
    private final LocalDate start;
    private final List<DemoCurve> curves;

    /**
     * @param start the first market date, moved to the following Monday when it falls on a weekend
     * @param curves at least one, with distinct names
     */
    public DemoScenario(long seed, LocalDate start, List<DemoCurve> curves) {
        this.seed = seed;
        this.start = businessDayOnOrAfter(Objects.requireNonNull(start, "start"));
        this.curves = List.copyOf(curves);
        if (this.curves.isEmpty()) {
            throw new IllegalArgumentException("a demo scenario needs at least one curve");
        }
        if (this.curves.stream().map(DemoCurve::name).distinct().count() != this.curves.size()) {
            throw new IllegalArgumentException("demo curve names must be distinct");
        }
    }

    /** The standard demo: {@code GOVT-A} through a tightening cycle and {@code GOVT-B} that never inverts. */
    public static DemoScenario standard(long seed, LocalDate start) {
        return new DemoScenario(seed, start, List.of(DemoCurve.tightening(), DemoCurve.steady()));
    }

    public long seed() {
        return seed;
    }

    /** The first market date of the scenario, a business day. */
    public LocalDate start() {
        return start;
    }

    public List<DemoCurve> curves() {
        return curves;
    }

    /** An endless run from the start, one {@link DemoDay} per business day. */
    @Override
    public Iterator<DemoDay> iterator() {
        return new Run();
    }

    /** The same endless run as an ordered stream; limit it. */
    public Stream<DemoDay> days() {
        return StreamSupport.stream(Spliterators.spliteratorUnknownSize(iterator(), Spliterator.ORDERED | Spliterator.NONNULL),
                false);
    }

    /** The snapshots of the first {@code businessDays} days, day by day and in curve order within a day. */
    public List<CurveSnapshot> snapshots(int businessDays) {
        if (businessDays < 0) {
            throw new IllegalArgumentException("business days must not be negative, got " + businessDays);
        }
        List<CurveSnapshot> out = new ArrayList<>(businessDays * curves.size());
        Iterator<DemoDay> run = iterator();
        for (int i = 0; i < businessDays; i++) {
            out.addAll(run.next().snapshots());
        }
        return out;
    }

    static LocalDate businessDayOnOrAfter(LocalDate date) {
        LocalDate d = date;
        while (d.getDayOfWeek() == DayOfWeek.SATURDAY || d.getDayOfWeek() == DayOfWeek.SUNDAY) {
            d = d.plusDays(1);
        }
        return d;
    }

    /** SplitMix64's finaliser: spreads nearby seeds (1, 2, 3, …) into unrelated streams. */
    static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    /** One pass through the scenario; holds each curve's factors and random stream. */
    private final class Run implements Iterator<DemoDay> {

        private final double[][] factors = new double[curves.size()][2];
        private final Random[] randoms = new Random[curves.size()];
        private final double[] years = new double[TENORS.size()];
        private final Tenor[] tenors = TENORS.toArray(new Tenor[0]);
        private LocalDate date;
        private long index = -1;

        Run() {
            for (int c = 0; c < curves.size(); c++) {
                randoms[c] = new Random(mix(seed ^ mix(curves.get(c).name().hashCode())));
            }
            for (int i = 0; i < tenors.length; i++) {
                years[i] = tenors[i].years();
            }
        }

        @Override
        public boolean hasNext() {
            return true;
        }

        @Override
        public DemoDay next() {
            LocalDate previous = date;
            date = previous == null ? start : businessDayOnOrAfter(previous.plusDays(1));
            index++;
            List<CurveSnapshot> snapshots = new ArrayList<>(curves.size());
            for (int c = 0; c < curves.size(); c++) {
                DemoCurve curve = curves.get(c);
                double[] x = factors[c];
                if (previous != null) {
                    curve.model().step(x, ChronoUnit.DAYS.between(previous, date) / DAYS_PER_YEAR, randoms[c]);
                }
                double gap = curve.policy().gapBp(start, date) / BP;
                double[] yields = new double[tenors.length];
                for (int i = 0; i < tenors.length; i++) {
                    double price = curve.model().bondPrice(years[i], x[0], x[1], gap);
                    double bp = BondEquivalent.fromPrice(price, years[i]) * BP + curve.quoteNoiseBp() * randoms[c].nextGaussian();
                    yields[i] = Math.round(bp * 10) / 10.0;
                }
                snapshots.add(CurveSnapshot.ofSorted(curve.name(), date, tenors, yields));
            }
            return new DemoDay(index, date, snapshots);
        }
    }
}
