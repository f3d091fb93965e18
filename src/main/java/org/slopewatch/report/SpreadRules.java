package org.slopewatch.report;

import java.util.List;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.PersistenceTest;
import org.slopewatch.monitor.Watch;

/**
 * One watched spread's monitor rules, broken into the parts a reader checks one by one.
 *
 * @param curves the curves it applies to; empty for every curve
 * @param tests  the persistence tests in the order they are tried, each as the policy words it
 */
public record SpreadRules(String spread, List<String> curves, double entryBelowBp, double exitAtOrAboveBp,
                          int exitObservations, int holdDays, List<String> tests) {

    public SpreadRules {
        curves = List.copyOf(curves);
        tests = List.copyOf(tests);
    }

    public static SpreadRules of(Watch watch) {
        MonitorDefinition d = watch.rules();
        return new SpreadRules(watch.spread().name(), watch.curves().stream().sorted().toList(), d.entryBelowBp(),
                d.exitAboveBp(), d.exitObservations(), d.holdDays(), d.tests().stream().map(PersistenceTest::describe).toList());
    }
}
