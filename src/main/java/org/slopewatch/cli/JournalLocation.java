package org.slopewatch.cli;

import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Where {@code --from-journal} points: a JDBC URL as given, or the daemon's data directory, whose
 * H2 journal is then opened read-only and only if it exists (a mistyped directory must not leave
 * an empty journal behind).
 *
 * @param url   the JDBC URL to open
 * @param label how reports name it: never with credentials
 */
record JournalLocation(String url, String label) {

    static final String H2_FILE = "journal.mv.db";

    static JournalLocation of(String journal) {
        if (journal.startsWith("jdbc:")) {
            return new JournalLocation(journal, withoutParameters(journal));
        }
        Path dir = Path.of(journal);
        if (!Files.isDirectory(dir)) {
            throw new IllegalArgumentException("--from-journal " + journal + ": not a directory; give the daemon's data directory"
                    + " (it holds " + H2_FILE + ") or a JDBC URL such as jdbc:postgresql://db:5432/slopewatch");
        }
        if (!Files.isRegularFile(dir.resolve(H2_FILE))) {
            throw new IllegalArgumentException("--from-journal " + journal + ": no " + H2_FILE + " in this directory; give the"
                    + " daemon's data directory (slopewatch.data-dir) or a JDBC URL");
        }
        String file = dir.toAbsolutePath().normalize().resolve("journal").toString();
        return new JournalLocation("jdbc:h2:file:" + file + ";IFEXISTS=TRUE;ACCESS_MODE_DATA=r", dir.resolve(H2_FILE).toString());
    }

    /** H2 keeps its file locked while a process has it open: the daemon, most likely. */
    static boolean inUse(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
            String m = String.valueOf(t.getMessage());
            if (m.contains("already in use") || m.contains("file is locked")) {
                return true;
            }
        }
        return false;
    }

    /** Drivers accept passwords after {@code ?} or {@code ;}: a report shows what comes before. */
    static String withoutParameters(String url) {
        int cut = url.length();
        for (char c : new char[] {'?', ';'}) {
            int at = url.indexOf(c);
            if (at >= 0) {
                cut = Math.min(cut, at);
            }
        }
        return url.substring(0, cut);
    }
}
