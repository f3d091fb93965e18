package org.slopewatch.testsupport;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.ingest.demo.DemoCurve;
import org.slopewatch.ingest.demo.DemoScenario;
import org.slopewatch.pipeline.QuoteMessage;

/**
 * The quotes the fault tests with packaged daemons send: curves through the demo's tightening cycle
 * (inversion, confirmation, re-steepening, so that notices are decided and delivered), each snapshot
 * with an id of its own, so that a message sent twice is told apart from a new one.
 */
public final class ScenarioQuotes {

    private ScenarioQuotes() {
    }

    /** The curves through the tightening cycle, each with its own random stream, in market-date order; ids {@code it:CURVE:DATE}. */
    public static List<QuoteMessage> tightening(List<String> curveNames, long seed, int businessDays) {
        DemoCurve template = DemoCurve.tightening();
        List<DemoCurve> curves = curveNames.stream()
                .map(name -> new DemoCurve(name, template.model(), template.policy(), template.quoteNoiseBp())).toList();
        List<QuoteMessage> out = new ArrayList<>();
        // the stream ends before 2026 however long it is: the daemon refuses market dates in the future
        LocalDate start = LocalDate.of(2026, 1, 1).minusDays(businessDays * 7L / 5 + 14);
        for (CurveSnapshot s : new DemoScenario(seed, start, curves).snapshots(businessDays)) {
            out.add(new QuoteMessage("it:" + s.curve() + ":" + s.date(), "integration-test", null, s.curve(), s.date(), s.asMap()));
        }
        return out;
    }
}
