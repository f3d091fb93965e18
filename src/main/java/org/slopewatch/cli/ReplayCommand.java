package org.slopewatch.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.PersistenceTest;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.Watch;
import org.slopewatch.probability.LeadTimeAnalysis;
import org.slopewatch.probability.RecessionCalendarCsv;
import org.slopewatch.replay.Replay;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.rules.PersistenceForms;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.spread.SpreadDefinition;
import org.slopewatch.text.Excerpt;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code slopewatch replay FILE}: history through the engine, a report out. */
@Command(name = "replay", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Replays yield history (CSV) through the inversion monitor and reports quarters, "
                + "transitions, spells and, with --recessions, lead times.",
                "Spreads and persistence tests come from --policy, or from --spread/--persistence.",
                "With --rules POLICY, a what-if: what that policy's alert rules would fire on FILE or --from-journal JOURNAL."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:report written", "1:could not read a file", "2:bad input or options (file:line: what is wrong)"})
final class ReplayCommand implements Callable<Integer> {

    @Parameters(index = "0", arity = "0..1", paramLabel = "FILE", description = "History CSV: wide 'date,3M,2Y,10Y,…' or long 'date,curve,tenor,yield', or as published: Treasury par yields, H.15, SDMX-CSV (docs/replay.md).")
    Path file;

    @Option(names = "--curve", paramLabel = "NAME", description = "Curve name for a wide file (default: the file name without extension).")
    String curve;

    @Mixin
    HistoryReading reading = new HistoryReading();


    @Option(names = "--policy", paramLabel = "FILE", description = "Policy file whose 'watch' part names the spreads and tests (see alert-rules/README.md).")
    Path policy;

    @Option(names = "--spread", paramLabel = "SPREAD", description = "Spread to watch, e.g. 10Y-3M, 10Y-2Y~ (interpolated legs) or near-term-forward. Repeatable. "
            + "With --rules: only these of the policy's spreads, by name or id (GOVT-A:10Y-3M).")
    List<String> spreads = new ArrayList<>();

    @Option(names = "--persistence", paramLabel = "TEST", description = "Persistence test: quarter-average, days-inverted:DAYS, rolling-average:DAYS, "
            + "share-inverted:DAYS:SHARE. Repeatable; the first that holds confirms. Default: quarter-average.")
    List<String> persistence = new ArrayList<>();

    @Option(names = "--entry-bp", paramLabel = "BP", defaultValue = "0", description = "A spell starts below this (default: ${DEFAULT-VALUE}).")
    double entryBp;

    @Option(names = "--exit-bp", paramLabel = "BP", description = "A spell ends at or above this (default: the entry threshold).")
    Double exitBp;

    @Option(names = "--exit-observations", paramLabel = "N", defaultValue = "1", description = "Observations at or above the exit threshold that end a spell (default: ${DEFAULT-VALUE}).")
    int exitObservations;

    @Option(names = "--hold-days", paramLabel = "DAYS", defaultValue = "365", description = "Days a re-steepened spread stays RESTEEPENING (default: ${DEFAULT-VALUE}).")
    int holdDays;

    @Option(names = "--recessions", paramLabel = "FILE", description = "Business-cycle dates, CSV 'peak,trough' (YYYY-MM), optionally ',peak_announced' (YYYY-MM-DD): adds lead times, "
            + "false alarms, and each peak signalled ahead, late or missed, against its announcement when given.")
    Path recessions;

    @Option(names = "--false-alarm-months", paramLabel = "N", defaultValue = "24", description = "A confirmation with no peak within N months is a false alarm (default: ${DEFAULT-VALUE}).")
    int falseAlarmMonths;

    @Option(names = "--json", description = "Write the report as JSON.")
    boolean json;

    @Option(names = "--transitions", description = "List every transition in the text report.")
    boolean listTransitions;

    @Option(names = "--report", paramLabel = "FILE", description = "Also write the report as one self-contained HTML page: "
            + "charts of each spread, spells, transitions, the policy and its hash, with --recessions the lead times.")
    Path htmlReport;
    @Mixin
    WhatIfOptions whatIf;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Integer whatIfExit = whatIf.runIfAsked(file, file == null ? null : curveName(), reading.unit, spreads, json);
        if (whatIfExit != null) {
            return whatIfExit;
        }
        try {
            List<Watch> watches = watches(err);
            LeadTimeAnalysis leads = null;
            if (recessions != null) {
                try (Reader r = Files.newBufferedReader(recessions, StandardCharsets.UTF_8)) {
                    leads = new LeadTimeAnalysis(RecessionCalendarCsv.read(r, recessions.toString()).recessions(), falseAlarmMonths);
                }
            }
            HistoryCsvReader.Options options = reading.options(curveName());
            long size = Files.size(file);
            ReplayReport report;
            Replay replay = new Replay(watches);
            try (InputStream raw = Files.newInputStream(file); CountingInputStream in = new CountingInputStream(raw);
                 ProgressBar bar = ProgressBar.forStderr("replay", size)) {
                report = replay.run(file.toString(), in, options, leads, () -> bar.update(in.count()));
            }
            if (report.spreads().isEmpty()) {
                err.println(file + ": none of the watched spreads (" + String.join(", ", watches.stream()
                        .map(w -> w.spread().name()).distinct().toList()) + ") could be computed from "
                        + report.snapshots() + " snapshots: are their tenors among the file's columns?");
                return 2;
            }
            if (htmlReport != null && HtmlReportOption.write(htmlReport, report, replay, policy, watches, recessions, err) != 0) {
                return 1;
            }
            if (json) {
                ReportJson.write(report, out);
            } else {
                new ReplayText(out, listTransitions).print(report);
            }
            return 0;
        } catch (HistoryFormatException | PolicyException | IllegalArgumentException e) {
            return ReplayFailure.input(e, err);
        } catch (IOException e) {
            return ReplayFailure.unreadable(e, err);
        }
    }

    private String curveName() {
        if (curve != null) {
            return curve;
        }
        String name = file.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }

    List<Watch> watches(PrintWriter err) throws IOException, PolicyException {
        if (policy != null) {
            if (!spreads.isEmpty() || !persistence.isEmpty()) {
                throw new IllegalArgumentException("give either --policy or --spread/--persistence, not both");
            }
            Policy parsed = PolicyParser.parse(policy.toString(), Files.readAllBytes(policy));
            parsed.warnings().forEach(err::println);
            return parsed.watches();
        }
        if (spreads.isEmpty()) {
            throw new IllegalArgumentException("nothing to watch: give --spread (e.g. --spread 10Y-3M) or --policy FILE");
        }
        List<PersistenceTest> tests = new ArrayList<>();
        for (String p : persistence.isEmpty() ? List.of(QuarterAverage.NAME) : persistence) {
            tests.add(PersistenceForms.parse(p, entryBp));
        }
        MonitorDefinition rules = new MonitorDefinition(entryBp, exitBp == null ? entryBp : exitBp, exitObservations, holdDays, tests);
        List<Watch> out = new ArrayList<>();
        for (String s : spreads) {
            out.add(new Watch(SpreadDefinition.parse(s), rules, Set.of()));
        }
        return out;
    }
}
