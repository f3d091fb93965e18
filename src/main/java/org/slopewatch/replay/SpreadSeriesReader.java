package org.slopewatch.replay;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import java.util.stream.Collectors;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.probability.SpreadObservation;
import org.slopewatch.spread.SpreadDefinition;
import org.slopewatch.text.Excerpt;

/**
 * Reads the series of one spread from a history file with the replay's reader, so the layouts,
 * units, bounds and {@code file:line} errors are exactly the replay's, and the spread is computed
 * by the same {@link SpreadDefinition} the monitor uses.
 */
public final class SpreadSeriesReader {

    private SpreadSeriesReader() {
    }

    /** Per curve: the observations and the dates without a value. */
    private static final class PerCurve {
        final List<SpreadObservation> observations = new ArrayList<>();
        long withoutValue;
    }

    /**
     * @param curve the curve to take from a long file with several curves, or null to take the
     *              file's only curve
     * @throws IllegalArgumentException {@code source: what is wrong} when the curve is ambiguous or
     *                                  unknown, or the spread cannot be computed on any date
     */
    public static SpreadSeries read(String source, InputStream in, HistoryCsvReader.Options options,
                                    SpreadDefinition spread, String curve) throws IOException, HistoryFormatException {
        Map<String, PerCurve> curves = new LinkedHashMap<>();
        TreeSet<Tenor> tenors = new TreeSet<>();
        HistoryCsvReader.Summary read = HistoryCsvReader.read(source, in, options, snapshot -> {
            PerCurve c = curves.computeIfAbsent(snapshot.curve(), k -> new PerCurve());
            collectTenors(snapshot, tenors);
            double bp = spread.valueBp(snapshot);
            if (Double.isFinite(bp)) {
                // percentage points: the unit the probit literature and its coefficients use
                c.observations.add(new SpreadObservation(snapshot.date(), bp / 100.0));
            } else {
                c.withoutValue++;
            }
        }, () -> { });
        String chosen = choose(source, curves, curve);
        PerCurve c = curves.get(chosen);
        if (c.observations.isEmpty()) {
            throw new IllegalArgumentException(source + ": spread " + spread.name() + " cannot be computed on any of the "
                    + c.withoutValue + " dates of curve " + chosen + "; the file quotes "
                    + tenors.stream().map(Tenor::toString).collect(Collectors.joining(", "))
                    + " (are the spread's tenors among them?)");
        }
        return new SpreadSeries(source, chosen, spread.name(), c.observations, c.withoutValue, read.rows());
    }

    private static String choose(String source, Map<String, PerCurve> curves, String curve) {
        if (curves.isEmpty()) {
            throw new IllegalArgumentException(source + ": no yields in the file");
        }
        if (curve != null) {
            if (!curves.containsKey(curve)) {
                throw new IllegalArgumentException(source + ": no curve " + Excerpt.quoted(curve) + " in the file (curves: "
                        + String.join(", ", curves.keySet()) + ")");
            }
            return curve;
        }
        if (curves.size() > 1) {
            throw new IllegalArgumentException(source + ": the file holds several curves (" + String.join(", ", curves.keySet())
                    + "); name the one to fit");
        }
        return curves.keySet().iterator().next();
    }

    private static void collectTenors(CurveSnapshot snapshot, TreeSet<Tenor> tenors) {
        for (int i = 0; i < snapshot.size(); i++) {
            tenors.add(snapshot.tenor(i));
        }
    }
}
