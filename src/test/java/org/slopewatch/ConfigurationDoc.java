package org.slopewatch;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The tables of docs/configuration.md. A key row is {@code | `key` | type | default | meaning |};
 * an environment row is {@code | `ENV_NAME` | `key` |}. A {@code <name>} segment of a key is a
 * map key and is read as {@link ConfigKey#ANY}.
 */
final class ConfigurationDoc {

    private static final Pattern SPAN = Pattern.compile("`([^`]+)`");
    private static final Pattern ENV_NAME = Pattern.compile("[A-Z][A-Z0-9_]*");

    record Row(String key, List<String> cells, int line) {

        String type() {
            return cells.get(1);
        }

        String defaultCell() {
            return cells.get(2);
        }

        /** The first code span of the default column, if any. */
        Optional<String> shownDefault() {
            Matcher m = SPAN.matcher(defaultCell());
            return m.find() ? Optional.of(m.group(1)) : Optional.empty();
        }

        /** Whether any cell of the row holds {@code text} as a code span. */
        boolean showsSpan(String text) {
            for (String cell : cells) {
                Matcher m = SPAN.matcher(cell);
                while (m.find()) {
                    if (m.group(1).equals(text)) {
                        return true;
                    }
                }
            }
            return false;
        }
    }

    record EnvRow(String variable, String key, int line) {
    }

    final Map<String, Row> rows = new LinkedHashMap<>();
    final List<EnvRow> envRows = new ArrayList<>();
    final List<String> problems = new ArrayList<>();

    static ConfigurationDoc read(Path file) throws IOException {
        ConfigurationDoc doc = new ConfigurationDoc();
        List<String> lines = Files.readAllLines(file);
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i).strip();
            if (!line.startsWith("|") || !line.endsWith("|") || line.startsWith("|---") || line.startsWith("| ---")) {
                continue;
            }
            List<String> cells = Arrays.stream(line.substring(1, line.length() - 1).split("\\|", -1)).map(String::strip).toList();
            Matcher first = SPAN.matcher(cells.get(0));
            if (!first.matches()) {
                continue;
            }
            int lineNo = i + 1;
            if (ENV_NAME.matcher(first.group(1)).matches()) {
                Matcher key = SPAN.matcher(cells.size() > 1 ? cells.get(1) : "");
                if (cells.size() != 2 || !key.matches()) {
                    doc.problems.add("line " + lineNo + ": an environment row is | `VARIABLE` | `key` |");
                } else {
                    doc.envRows.add(new EnvRow(first.group(1), normalised(key.group(1)), lineNo));
                }
                continue;
            }
            String key = normalised(first.group(1));
            if (cells.size() != 4) {
                doc.problems.add("line " + lineNo + ": the row of " + first.group(1) + " needs four cells: key, type, default, meaning");
            } else if (doc.rows.containsKey(key)) {
                doc.problems.add("line " + lineNo + ": " + first.group(1) + " has a row already, at line " + doc.rows.get(key).line());
            } else {
                doc.rows.put(key, new Row(key, cells, lineNo));
            }
        }
        return doc;
    }

    static String normalised(String key) {
        return key.replaceAll("<[^>.]+>", ConfigKey.ANY);
    }

    /** The row of exactly this key. */
    Optional<Row> row(String key) {
        return Optional.ofNullable(rows.get(key));
    }

    /** The row of this key, or of a pattern covering it. */
    Optional<Row> rowCovering(String key) {
        Row exact = rows.get(key);
        if (exact != null) {
            return Optional.of(exact);
        }
        return rows.values().stream().filter(r -> ConfigKey.covers(r.key(), key)).findFirst();
    }
}
