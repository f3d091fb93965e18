package org.slopewatch.whatif;

import java.util.EnumSet;
import java.util.List;
import java.util.function.LongConsumer;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.replay.CandidatePolicy;
import org.slopewatch.replay.LiveNotice;
import org.slopewatch.replay.SpreadFilter;
import org.slopewatch.replay.WhatIf;
import org.slopewatch.replay.WhatIfReport;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertDecision;

/**
 * A what-if on a journal's history: every stored quote in recorded order through a
 * {@link WhatIf} of the policy tried, compared with the first notices the journal holds. Reads
 * only; plain Java, so the command line uses it on a journal the daemon is not running on.
 */
public final class JournalWhatIf {

    private final JournalReader reader;
    private final AlertHistory alerts;

    public JournalWhatIf(JournalReader reader, AlertHistory alerts) {
        this.reader = reader;
        this.alerts = alerts;
    }

    /** Quote messages stored now: how long a run will be. */
    public long quoteCount() {
        return reader.quoteCount();
    }

    /**
     * @param source   how the journal is named in the report (never with credentials)
     * @param progress told the number of quote messages taken so far, after each one
     */
    public WhatIfReport run(String source, CandidatePolicy policy, SpreadFilter filter, LongConsumer progress) {
        // what fired is read first: a notice can then only be missing for quotes stored after it, at the newest dates
        List<LiveNotice> live = alerts.notices(EnumSet.of(Alert.Kind.FIRING, Alert.Kind.RESOLVED)).stream()
                .map(JournalWhatIf::live).toList();
        WhatIf whatIf = new WhatIf(policy, filter);
        reader.replayQuotes(q -> {
            whatIf.quote(q.curve(), q.date(), q.yieldsBp());
            progress.accept(whatIf.quotes());
        });
        whatIf.note("Notices were read from the journal before its quotes: while the daemon runs, quotes stored in between"
                + " can show as extra notices at the newest dates.");
        return whatIf.report(source, live);
    }

    private static LiveNotice live(AlertHistory.StoredAlert a) {
        Alert alert = a.alert();
        // a notice about a feed has no market date; its episode date stands in (feed notices are not compared)
        return new LiveNotice(alert.rule(), a.subject(), AlertDecision.Notice.valueOf(alert.kind().name()), a.episodeSince(),
                alert.marketDate() != null ? alert.marketDate() : a.episodeSince(), a.policyHash());
    }
}
