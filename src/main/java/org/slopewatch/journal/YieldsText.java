package org.slopewatch.journal;

import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
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
        for (String pair : text.split(";")) {
            int eq = pair.indexOf('=');
            out.put(Tenor.parse(pair.substring(0, eq)), Double.parseDouble(pair.substring(eq + 1)));
        }
        return out;
    }
}
