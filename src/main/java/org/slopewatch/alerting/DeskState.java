package org.slopewatch.alerting;

import java.time.LocalDate;
import java.util.List;
import java.util.Set;
import org.slopewatch.journal.Acknowledgements;
import org.slopewatch.journal.DeskChanges;
import org.slopewatch.journal.QuietPeriodBook;

/**
 * What people set on the desk, as the journal holds it: every quiet period and the acknowledged
 * episodes. Several instances share one journal and each decides the notices of its own curves,
 * so a quiet period, a lift or an acknowledgement made through any of them must hold for all.
 *
 * <p>The bound, and the one place that keeps it: before {@link AlertDesk} lets a notice out (and
 * on each tick, and before the API lists quiet periods or open episodes) it calls
 * {@link #refresh()}, which reads the journal's change counter ({@link DeskChanges}, one
 * primary-key lookup) and, when it moved, the quiet periods and acknowledged episodes again. So a
 * change committed on any instance holds for every notice any instance decides after that commit:
 * no delay beyond the commit itself, and no query at all on a step that decides no notice. The
 * counter is read before the rows, so a change committed in between is read again next time rather
 * than missed.
 *
 * <p>Not thread-safe: the desk calls it under its own lock.
 */
final class DeskState {

    private final DeskChanges changes;
    private final QuietPeriodBook quietPeriodBook;
    private final Acknowledgements acks;

    private long seen = -1;
    private List<QuietPeriodBook.QuietPeriod> quietPeriods = List.of();
    private Set<String> acknowledged = Set.of();

    DeskState(DeskChanges changes, QuietPeriodBook quietPeriodBook, Acknowledgements acks) {
        this.changes = changes;
        this.quietPeriodBook = quietPeriodBook;
        this.acks = acks;
    }

    /**
     * Reads the quiet periods and acknowledgements again if anything changed since the last read.
     *
     * @return whether they were read again
     */
    boolean refresh() {
        long now = changes.counter();
        if (now == seen) {
            return false;
        }
        quietPeriods = quietPeriodBook.all();
        acknowledged = acks.acknowledgedEpisodes();
        seen = now;
        return true;
    }

    /** Reads everything again, changed or not (on start and after a failed write). */
    void reload() {
        seen = -1;
        refresh();
    }

    /** Every quiet period, newest first. */
    List<QuietPeriodBook.QuietPeriod> quietPeriods() {
        return quietPeriods;
    }

    boolean acknowledged(String rule, String subject, LocalDate since) {
        return since != null && acknowledged.contains(Acknowledgements.episodeKey(rule, subject, since));
    }
}
