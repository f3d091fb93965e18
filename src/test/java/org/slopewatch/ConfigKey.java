package org.slopewatch;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * One configuration key as the code uses it, gathered from every place that mentions it: a
 * {@code @ConfigMapping} method, a string literal in the sources, application.properties. A map
 * key segment is written {@link #ANY}, so {@code slopewatch.channels.<*>.type} stands for every
 * channel name.
 */
final class ConfigKey {

    /** A segment that stands for any name (a map key). */
    static final String ANY = "<*>";

    final String key;
    /** Where the code mentions the key, for failure messages. */
    final List<String> foundIn = new ArrayList<>();
    /** True when a {@code @ConfigMapping} declares the key: then "no default" is known too. */
    boolean mapped;
    /** The {@code @WithDefault} value. */
    String mappingDefault;
    /** The word the doc's type column must contain, for mapped keys. */
    String typeWord;
    /** For an enum-typed key, the values as they are written in configuration. */
    List<String> enumValues = List.of();
    /** The value application.properties gives without a profile. */
    String propertiesValue;
    /** Values application.properties gives under a profile, by profile. */
    final Map<String, String> profileValues = new TreeMap<>();
    /** Fallbacks of {@code ${key:fallback}} references in application.properties. */
    final Set<String> referenceFallbacks = new TreeSet<>();
    boolean referencedWithoutFallback;

    ConfigKey(String key) {
        this.key = key;
    }

    /**
     * The value the key has when an operator sets nothing: application.properties first, then
     * the mapping's default, then the fallback every reference to it agrees on.
     */
    Optional<String> expectedDefault() {
        if (propertiesValue != null) {
            return Optional.of(propertiesValue);
        }
        if (mappingDefault != null) {
            return Optional.of(mappingDefault);
        }
        if (referenceFallbacks.size() == 1 && !referencedWithoutFallback) {
            return Optional.of(referenceFallbacks.iterator().next());
        }
        return Optional.empty();
    }

    /** Whether the default is known, including knowing there is none. */
    boolean defaultKnown() {
        return expectedDefault().isPresent() || mapped;
    }

    /** {@code pattern} covers {@code key} when they are equal segment by segment, {@link #ANY} matching any one segment. */
    static boolean covers(String pattern, String key) {
        String[] p = pattern.split("\\.", -1);
        String[] k = key.split("\\.", -1);
        if (p.length != k.length) {
            return false;
        }
        for (int i = 0; i < p.length; i++) {
            if (!p[i].equals(ANY) && !p[i].equals(k[i])) {
                return false;
            }
        }
        return true;
    }

    /** The key as the doc writes it: a map segment as {@code <name>}. */
    String shown() {
        return key.replace(ANY, "<name>");
    }

    @Override
    public String toString() {
        return shown() + " (" + String.join("; ", foundIn) + ")";
    }
}
