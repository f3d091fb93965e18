package org.slopewatch.ingest.demo;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slopewatch.curve.CurveSnapshot;

/**
 * One business day of the demo scenario: a snapshot per curve, in the scenario's curve order.
 *
 * @param index business days since the start (the start date is 0)
 */
public record DemoDay(long index, LocalDate date, List<CurveSnapshot> snapshots) {

    public DemoDay {
        snapshots = List.copyOf(snapshots);
    }

    /** The day's yields as single quotes, curve by curve, tenors in maturity order. */
    public List<DemoQuote> quotes() {
        List<DemoQuote> quotes = new ArrayList<>();
        for (CurveSnapshot s : snapshots) {
            for (int i = 0; i < s.size(); i++) {
                quotes.add(new DemoQuote(s.curve(), s.tenor(i), date, s.yieldBp(i)));
            }
        }
        return quotes;
    }
}
