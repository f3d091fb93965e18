package org.slopewatch.journal;

import java.util.ArrayList;
import java.util.List;
import org.slopewatch.rules.Alert;

/**
 * An alert's facts in one text column: one {@code label<TAB>value} pair per line. Tabs and line
 * breaks inside a label or value become spaces, since facts are short and read by people.
 */
final class FactsText {

    private FactsText() {
    }

    static String write(List<Alert.Fact> facts) {
        StringBuilder b = new StringBuilder();
        for (Alert.Fact f : facts) {
            if (!b.isEmpty()) {
                b.append('\n');
            }
            b.append(flat(f.label())).append('\t').append(flat(f.value()));
        }
        return b.toString();
    }

    static List<Alert.Fact> read(String text) {
        List<Alert.Fact> out = new ArrayList<>();
        if (text == null || text.isEmpty()) {
            return out;
        }
        for (String line : text.split("\n")) {
            int tab = line.indexOf('\t');
            out.add(tab < 0 ? new Alert.Fact(line, "") : new Alert.Fact(line.substring(0, tab), line.substring(tab + 1)));
        }
        return out;
    }

    private static String flat(String s) {
        return s == null ? "" : s.replace('\t', ' ').replace('\n', ' ').replace('\r', ' ');
    }
}
