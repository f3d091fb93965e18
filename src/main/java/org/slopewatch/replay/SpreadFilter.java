package org.slopewatch.replay;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.slopewatch.monitor.Watch;
import org.slopewatch.spread.SpreadKey;

/**
 * The spreads a what-if looks at: entries are spread ids ({@code GOVT-A:10Y-3M}) or spread names
 * ({@code 10Y-3M}, every curve); no entry means every spread the policy watches.
 */
public record SpreadFilter(List<String> entries) {

    public static final SpreadFilter ALL = new SpreadFilter(List.of());

    public SpreadFilter {
        List<String> clean = new ArrayList<>();
        for (String e : entries) {
            if (e == null || e.isBlank()) {
                throw new IllegalArgumentException("an empty spread in the spread list: give ids such as GOVT-A:10Y-3M or names such as 10Y-3M");
            }
            if (e.indexOf(':') >= 0) {
                SpreadKey.parse(e.strip()); // says what is wrong with an id such as 'GOVT-A:'
            }
            clean.add(e.strip());
        }
        entries = List.copyOf(new LinkedHashSet<>(clean));
    }

    public static SpreadFilter of(List<String> entries) {
        return entries == null || entries.isEmpty() ? ALL : new SpreadFilter(entries);
    }

    public boolean isAll() {
        return entries.isEmpty();
    }

    /** Whether a spread id such as {@code GOVT-A:10Y-3M} passes. */
    public boolean matches(String spreadId) {
        if (isAll()) {
            return true;
        }
        int colon = spreadId.lastIndexOf(':');
        String name = colon < 0 ? spreadId : spreadId.substring(colon + 1);
        return entries.contains(spreadId) || entries.contains(name);
    }

    /**
     * The policy's watches narrowed to the filter, so that spreads nobody asked about are not
     * computed at all (a fitted-curve spread costs a curve fit per snapshot). A watch named by
     * spread alone is kept whole; one named by ids watches only those curves.
     */
    public List<Watch> narrow(List<Watch> watches) {
        if (isAll()) {
            return watches;
        }
        List<Watch> out = new ArrayList<>();
        for (Watch w : watches) {
            String name = w.spread().name();
            if (entries.contains(name)) {
                out.add(w);
                continue;
            }
            Set<String> curves = new LinkedHashSet<>();
            for (String e : entries) {
                if (e.indexOf(':') > 0) {
                    SpreadKey key = SpreadKey.parse(e);
                    if (key.spread().equals(name) && w.appliesTo(key.curve())) {
                        curves.add(key.curve());
                    }
                }
            }
            // an empty set would mean every curve to Watch: leave the watch out instead
            if (!curves.isEmpty()) {
                out.add(new Watch(w.spread(), w.rules(), curves));
            }
        }
        return out;
    }
}
