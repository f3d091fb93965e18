package org.slopewatch.cli;

import java.io.PrintWriter;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.slopewatch.replay.WhatIfReport;

/** A what-if report as text for people: what would fire, how that differs from what fired, and what the run cannot say. */
final class WhatIfText {

    private final PrintWriter out;

    WhatIfText(PrintWriter out) {
        this.out = out;
    }

    void print(WhatIfReport r) {
        out.printf(Locale.ROOT, "slopewatch what-if on %s%n", r.source());
        out.printf(Locale.ROOT, "  policy tried  %s (sha256 %s)%n", r.policy(), r.policySha256());
        out.printf(Locale.ROOT, "  history       %,d %s, %s to %s%n", r.quotes(), r.compared() ? "quote messages" : "snapshots",
                orDash(r.firstDate()), orDash(r.lastDate()));
        out.printf(Locale.ROOT, "  spreads       %s%s%n", r.spreads().isEmpty() ? "none" : String.join(", ", r.spreads()),
                r.spreadFilter().isEmpty() ? "" : " (asked for: " + String.join(", ", r.spreadFilter()) + ")");
        out.println();
        wouldFire(r.wouldFire());
        if (r.compared()) {
            out.println();
            comparison(r);
        }
        out.println();
        out.println("  notes");
        r.notes().forEach(n -> out.println("    - " + n));
        out.println();
        out.println(r.caution());
    }

    private void wouldFire(List<WhatIfReport.Notice> notices) {
        out.println("  would send (opening and closing notices, by market date)");
        if (notices.isEmpty()) {
            out.println("    nothing");
            return;
        }
        List<String[]> rows = new ArrayList<>();
        rows.add(new String[] {"market date", "kind", "rule", "subject", "severity", "episode since"});
        for (WhatIfReport.Notice n : notices) {
            rows.add(new String[] {n.marketDate().toString(), n.kind(), n.rule(), n.subject(), n.severity(), orDash(n.episodeSince())});
        }
        table(rows);
    }

    private void comparison(WhatIfReport r) {
        out.println("  compared with what fired (opening notices, by rule and subject)");
        if (r.comparison().isEmpty()) {
            out.println("    nothing fired and nothing would fire");
        } else {
            List<String[]> rows = new ArrayList<>();
            rows.add(new String[] {"rule", "subject", "fired", "would fire", "difference"});
            for (WhatIfReport.Comparison c : r.comparison()) {
                rows.add(new String[] {c.rule(), c.subject(), orDash(c.liveMarketDate()), orDash(c.triedMarketDate()), difference(c)});
            }
            table(rows);
        }
        WhatIfReport.Counts k = r.counts();
        out.printf(Locale.ROOT, "    same %d, earlier %d, later %d, not-at-all %d, extra %d (%d opening notices fired, %d would fire)%n",
                k.same(), k.earlier(), k.later(), k.notAtAll(), k.extra(), k.liveFirstNotices(), k.wouldFire());
        if (!r.livePolicyHashes().isEmpty()) {
            out.printf(Locale.ROOT, "    notices that fired were decided under policy %s%n", String.join(", ", r.livePolicyHashes()));
        }
    }

    private static String difference(WhatIfReport.Comparison c) {
        if (c.calendarDays() == null || c.calendarDays() == 0) {
            return c.difference();
        }
        return String.format(Locale.ROOT, "%s by %d market day%s (%d calendar day%s)", c.difference(), c.marketDays(),
                c.marketDays() == 1 ? "" : "s", c.calendarDays(), c.calendarDays() == 1 ? "" : "s");
    }

    /** Columns as wide as their widest cell; the last one is not padded. */
    private void table(List<String[]> rows) {
        int[] width = new int[rows.get(0).length];
        for (String[] row : rows) {
            for (int i = 0; i < row.length; i++) {
                width[i] = Math.max(width[i], row[i].length());
            }
        }
        for (String[] row : rows) {
            StringBuilder b = new StringBuilder("    ");
            for (int i = 0; i < row.length; i++) {
                b.append(i == row.length - 1 ? row[i] : String.format(Locale.ROOT, "%-" + width[i] + "s  ", row[i]));
            }
            out.println(b.toString().stripTrailing());
        }
    }

    private static String orDash(LocalDate date) {
        return date == null ? "-" : date.toString();
    }
}
