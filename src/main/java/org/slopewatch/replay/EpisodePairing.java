package org.slopewatch.replay;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * Pairs the opening notices of one rule and subject that fired live with those a policy tried
 * would fire, both in date order. A rule and subject can have many episodes over a long history
 * (one per inversion), and a changed policy can add or drop some, so pairing by position would
 * compare unrelated episodes. Instead the pairing keeps date order and makes the paired dates
 * as close as possible in total, and never pairs dates more than {@code windowDays} apart: an
 * alignment with a gap cost, as a diff of two sorted lists.
 */
final class EpisodePairing {

    /** Indexes into the two lists; one of them is null for a notice without a counterpart. */
    record Pair(Integer live, Integer tried) {
    }

    private EpisodePairing() {
    }

    /**
     * @param live  live first-notice dates, ascending
     * @param tried the policy tried's first-notice dates, ascending
     * @return every index of both lists exactly once, paired or alone
     */
    static List<Pair> pair(List<LocalDate> live, List<LocalDate> tried, int windowDays) {
        int n = live.size();
        int m = tried.size();
        // leaving a notice unpaired costs more than any allowed pairing, so that two notices
        // within the window are always paired rather than reported as one dropped and one added
        long gap = windowDays + 1L;
        long[][] cost = new long[n + 1][m + 1];
        for (int i = 1; i <= n; i++) {
            cost[i][0] = i * gap;
        }
        for (int j = 1; j <= m; j++) {
            cost[0][j] = j * gap;
        }
        for (int i = 1; i <= n; i++) {
            for (int j = 1; j <= m; j++) {
                long best = Math.min(cost[i - 1][j], cost[i][j - 1]) + gap;
                long apart = Math.abs(ChronoUnit.DAYS.between(live.get(i - 1), tried.get(j - 1)));
                if (apart <= windowDays) {
                    best = Math.min(best, cost[i - 1][j - 1] + apart);
                }
                cost[i][j] = best;
            }
        }
        List<Pair> out = new ArrayList<>(n + m);
        int i = n;
        int j = m;
        while (i > 0 || j > 0) {
            if (i > 0 && j > 0) {
                long apart = Math.abs(ChronoUnit.DAYS.between(live.get(i - 1), tried.get(j - 1)));
                if (apart <= windowDays && cost[i][j] == cost[i - 1][j - 1] + apart) {
                    out.add(new Pair(--i, --j));
                    continue;
                }
            }
            if (i > 0 && cost[i][j] == cost[i - 1][j] + gap) {
                out.add(new Pair(--i, null));
            } else {
                out.add(new Pair(null, --j));
            }
        }
        Collections.reverse(out);
        return out;
    }
}
