package org.slopewatch.history;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.TenorAliases;
import org.slopewatch.text.Excerpt;

/**
 * Which curve and tenor each series of an SDMX-CSV file quotes. A statistical series key names a
 * yield in the publisher's code lists, not in the desk's words; the map says it once, in a small
 * file of lines {@code KEY,CURVE,TENOR}, the key being the series' dimension values joined by dots
 * in the file's column order, such as {@code B.U2.EUR.4F.G_N_A.SV_C_YM.SR_10Y,GOVT-EUR,10Y}.
 * Blank lines and lines starting with {@code #} are comments; an optional first line
 * {@code series,curve,tenor} is a header.
 */
public final class SeriesMap {

    /** No map: an SDMX-CSV file is refused, since none of its series could be placed. */
    public static final SeriesMap NONE = new SeriesMap("(none)", Map.of());

    /** Where a series' yields go; {@code written} is the tenor as the map writes it. */
    record Target(String curve, Tenor written) {
        Tenor tenor() {
            return TenorAliases.canonical(written);
        }
    }

    private final String source;
    private final Map<String, Target> targets;

    private SeriesMap(String source, Map<String, Target> targets) {
        this.source = source;
        this.targets = Map.copyOf(targets);
    }

    /**
     * Reads a map file.
     *
     * @throws IllegalArgumentException naming the file and line of a line that is no {@code KEY,CURVE,TENOR}, or a key twice
     */
    public static SeriesMap read(Path file) throws IOException {
        Map<String, Target> targets = new HashMap<>();
        try (BufferedReader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String line;
            int n = 0;
            while ((line = in.readLine()) != null) {
                n++;
                String t = line.strip();
                if (t.isEmpty() || t.startsWith("#") || (targets.isEmpty() && t.equalsIgnoreCase("series,curve,tenor"))) {
                    continue;
                }
                String[] cells = t.split(",", -1);
                String where = file + ":" + n + ": ";
                if (cells.length != 3 || cells[0].isBlank() || cells[1].isBlank()) {
                    throw new IllegalArgumentException(where + "expected KEY,CURVE,TENOR, found " + Excerpt.quoted(t));
                }
                Tenor written;
                try {
                    written = Tenor.parse(cells[2]);
                } catch (IllegalArgumentException e) {
                    throw new IllegalArgumentException(where + e.getMessage());
                }
                if (targets.put(cells[0].strip(), new Target(cells[1].strip(), written)) != null) {
                    throw new IllegalArgumentException(where + "series " + Excerpt.quoted(cells[0].strip()) + " is mapped twice");
                }
            }
        }
        return new SeriesMap(file.toString(), targets);
    }

    /** The map in {@code file}, or {@link #NONE} without one; see {@link #read}. */
    public static SeriesMap readOrNone(Path file) throws IOException {
        return file == null ? NONE : read(file);
    }

    /** Where the series {@code key} goes, or null when the map does not name it. */
    Target target(String key) {
        return targets.get(key);
    }

    boolean isEmpty() {
        return targets.isEmpty();
    }

    /** The map's file, for messages. */
    String source() {
        return source;
    }
}
