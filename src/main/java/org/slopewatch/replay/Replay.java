package org.slopewatch.replay;

import java.io.IOException;
import java.io.InputStream;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.monitor.MonitorEvent;
import org.slopewatch.monitor.QuarterSummary;
import org.slopewatch.monitor.Revision;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpellRestatement;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.SpreadTrack;
import org.slopewatch.monitor.Transition;
import org.slopewatch.monitor.Watch;
import org.slopewatch.probability.Confirmation;
import org.slopewatch.probability.LeadTimeAnalysis;
import org.slopewatch.probability.LeadTimeReport;
import org.slopewatch.spread.SpreadKey;

/**
 * Replays history through the same engine objects the daemon drives and gathers a report:
 * complete quarters, transitions, spells, revisions and, with recession dates, lead times.
 */
public final class Replay {

    private final SignalEngine engine;
    private final Map<SpreadKey, Log> logs = new HashMap<>();
    private long sequence;

    /** What one spread produced, in order. */
    private static final class Log {
        final List<SpreadReport.QuarterRow> quarters = new ArrayList<>();
        final List<Transition> transitions = new ArrayList<>();
        final List<Spell> spells = new ArrayList<>();
        final List<Revision> revisions = new ArrayList<>();
    }

    public Replay(List<Watch> watches) {
        this.engine = new SignalEngine(watches);
    }

    /**
     * Reads the whole input and returns the report.
     *
     * @param leadTimes recession dates to measure confirmations against, or null
     * @param progress  called every few thousand rows
     */
    public ReplayReport run(String source, InputStream in, HistoryCsvReader.Options options, LeadTimeAnalysis leadTimes,
                            Runnable progress) throws IOException, HistoryFormatException {
        HistoryCsvReader.Summary read = HistoryCsvReader.read(source, in, options,
                snapshot -> record(engine.onSnapshot(snapshot, ++sequence)), progress);
        List<SpreadReport> spreads = new ArrayList<>();
        for (SpreadTrack track : tracks()) {
            spreads.add(report(track, read, leadTimes));
        }
        return new ReplayReport(source, read.rows(), read.quotes(), read.snapshots(), read.first(), read.last(),
                leadTimes == null ? null : leadTimes.windowMonths(), spreads, ReplayReport.CAUTION);
    }

    /**
     * After {@link #run}: each spread's standing values, in the order of the report's spreads. The
     * report itself leaves them out (its JSON would grow by every date); a chart needs them.
     */
    public List<SpreadValues> values() {
        List<SpreadValues> out = new ArrayList<>();
        for (SpreadTrack track : tracks()) {
            int[] days = new int[track.size()];
            double[] bp = new double[track.size()];
            for (int i = 0; i < days.length; i++) {
                days[i] = (int) track.date(i).toEpochDay();
                bp[i] = track.valueBp(i);
            }
            out.add(new SpreadValues(track.spread().id(), days, bp));
        }
        return out;
    }

    /**
     * After {@link #run}: where each spread stands at the end of the data, as the daemon's status of
     * it would read, in the order of the report's spreads (a probability model reads its month averages).
     */
    public List<SpreadStatus> statuses() {
        return tracks().stream().map(SpreadStatus::of).toList();
    }

    /**
     * The spreads in the report's order: by curve name, each curve's in the order its spreads were
     * first computed. Unlike the order the engine met them in, it does not depend on how a file
     * interleaves its curves, so that a file sorted by curve and one sorted by date report alike.
     */
    private List<SpreadTrack> tracks() {
        List<SpreadTrack> tracks = new ArrayList<>(engine.tracks());
        tracks.sort(Comparator.comparing(t -> t.spread().curve())); // stable: a curve's own order stays
        return tracks;
    }

    private void record(List<MonitorEvent> events) {
        for (MonitorEvent e : events) {
            if (e instanceof QuarterSummary q) {
                log(q.spread()).quarters.add(new SpreadReport.QuarterRow(q.quarter().toString(), q.averageBp(), q.observations()));
            } else if (e instanceof Transition t) {
                log(t.spread()).transitions.add(t);
            } else if (e instanceof Spell s) {
                log(s.spread()).spells.add(s);
            } else if (e instanceof Revision r) {
                log(r.spread()).revisions.add(r);
            } else if (e instanceof SpellRestatement r) {
                // a file's dates ascend, so none comes here; were one to, the spells stand as restated
                List<Spell> spells = log(r.spread()).spells;
                r.spells().forEach(restated -> spells.replaceAll(s -> s.id() == restated.id() ? restated : s));
            }
        }
    }

    private Log log(SpreadKey key) {
        return logs.computeIfAbsent(key, k -> new Log());
    }

    private SpreadReport report(SpreadTrack track, HistoryCsvReader.Summary read, LeadTimeAnalysis leadTimes) {
        SpreadKey key = track.spread();
        Log log = logs.getOrDefault(key, new Log());
        List<Spell> spells = new ArrayList<>(log.spells);
        Spell open = track.state().openSpell();
        if (open != null) {
            spells.add(open);
        }
        LeadTimeReport leads = null;
        if (leadTimes != null) {
            leads = leadTimes.analyse(confirmations(log.transitions), track.date(0), track.date(track.size() - 1));
        }
        return new SpreadReport(key.id(), key.curve(), key.spread(), track.rules().describe(), track.size(),
                track.state().state().name(), track.state().lastDate(), track.state().lastValueBp(),
                log.quarters,
                log.transitions.stream().map(Replay::row).toList(),
                spells.stream().map(Replay::row).toList(),
                log.revisions.stream().map(r -> new SpreadReport.RevisionRow(r.from(),
                        r.before().stream().map(Transition::toString).toList(),
                        r.after().stream().map(Transition::toString).toList())).toList(),
                leads == null ? null : leads.leads(),
                leads == null ? null : leads.peaks(),
                leads == null ? null : leads.missedPeaks(),
                leads == null ? null : leads.unassessedPeaks());
    }

    /**
     * Each confirmation with the re-steepening of the same spell (the transition into RESTEEPENING
     * carries the spell's id), or none while the spell was still open at the end of the data.
     */
    private static List<Confirmation> confirmations(List<Transition> transitions) {
        Map<Long, LocalDate> resteepened = new HashMap<>();
        for (Transition t : transitions) {
            if (t.to() == SpreadState.RESTEEPENING) {
                resteepened.put(t.spellId(), t.date());
            }
        }
        List<Confirmation> out = new ArrayList<>();
        for (Transition t : transitions) {
            if (t.to() == SpreadState.CONFIRMED) {
                out.add(new Confirmation(t.date(), resteepened.get(t.spellId())));
            }
        }
        return out;
    }

    private static SpreadReport.TransitionRow row(Transition t) {
        return new SpreadReport.TransitionRow(t.date(), t.from().name(), t.to().name(), t.evidence().test(),
                t.evidence().window(), t.evidence().measured(), t.evidence().valueBp(), t.spellId(), t.reason());
    }

    private static SpreadReport.SpellRow row(Spell s) {
        return new SpreadReport.SpellRow(s.id(), s.start(), s.confirmed(), s.confirmedBy(), s.end(), s.durationDays(),
                s.observations(), s.deepestBp(), s.deepestDate(), s.invertedAreaBpDays());
    }
}
