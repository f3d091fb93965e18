package org.slopewatch.journal;

import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import org.slopewatch.curve.Tenor;

/**
 * The journal's text form of a message's yields: {@code 3M=510.0;10Y=421.5} (basis points).
 * One row per message rather than per tenor keeps the journal write cheap at tens of thousands
 * of quotes a second; {@link Double#toString} round-trips exactly.
 */
final class YieldsText {

    private YieldsText() {
    }

    static String write(SortedMap<Tenor, Double> yieldsBp) {
        StringBuilder b = new StringBuilder(yieldsBp.size() * 12);
        for (Map.Entry<Tenor, Double> e : yieldsBp.entrySet()) {
            if (b.length() > 0) {
                b.append(';');
            }
            b.append(e.getKey()).append('=').append(e.getValue().doubleValue());
        }
        return b.toString();
    }

    static SortedMap<Tenor, Double> read(String text) {
        SortedMap<Tenor, Double> out = new TreeMap<>();
        int start = 0;
        while (start < text.length()) {
            int end = text.indexOf(';', start);
            if (end < 0) {
                end = text.length();
            }
            int eq = text.indexOf('=', start);
            if (eq < 0 || eq > end) {
                throw new IllegalArgumentException("malformed yields text, expected tenor=bp pairs: " + text);
            }
            out.put(tenor(text.substring(start, eq)), Double.parseDouble(text.substring(eq + 1, end)));
            start = end + 1;
        }
        return out;
    }

    /**
     * Recovery reads every journalled message, and parsing its tenors with the grammar's regular
     * expression was the largest single cost of a restart. The journal only holds the spellings
     * {@link #write} produced, a few dozen at most; the bound keeps a hand-edited journal from
     * growing the cache.
     */
    private static final Map<String, Tenor> TENORS = new ConcurrentHashMap<>();

    private static Tenor tenor(String spelling) {
        Tenor t = TENORS.get(spelling);
        if (t == null) {
            t = Tenor.parse(spelling);
            if (TENORS.size() < 256) {
                TENORS.put(spelling, t);
            }
        }
        return t;
    }
}
