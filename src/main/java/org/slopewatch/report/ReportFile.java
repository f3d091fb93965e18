package org.slopewatch.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/** Writes a report so that the target is either the whole new page or left as it was, never half a page. */
public final class ReportFile {

    private ReportFile() {
    }

    public static void write(Path target, String html) throws IOException {
        // a plain sibling rather than createTempFile, whose owner-only permissions the move would keep
        Path temp = target.toAbsolutePath().resolveSibling("." + target.getFileName() + ".tmp");
        try {
            Files.writeString(temp, html, StandardCharsets.UTF_8);
            try {
                Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(temp);
        }
    }
}
