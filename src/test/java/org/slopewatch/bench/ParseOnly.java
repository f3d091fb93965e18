package org.slopewatch.bench;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;

/**
 * The end-to-end baseline of the replay benchmark: a process that parses a history file as
 * {@code ./slopewatch replay} does ({@link HistoryCsvReader#read}, percent, the default bounds, the file
 * read through {@link Files#newInputStream}) and does nothing with the snapshots, then prints what it
 * read. Usage: {@code ParseOnly FILE}. Not a test (surefire excludes bench/).
 */
public final class ParseOnly {

    private ParseOnly() {
    }

    public static void main(String[] args) throws IOException, HistoryFormatException {
        if (args.length != 1) {
            System.err.println("usage: ParseOnly FILE");
            System.exit(2);
        }
        Path file = Path.of(args[0]);
        String name = file.getFileName().toString();
        String curve = name.contains(".") ? name.substring(0, name.lastIndexOf('.')) : name; // as the launcher names a wide file's curve
        HistoryCsvReader.Summary s;
        try (InputStream in = Files.newInputStream(file)) {
            s = HistoryCsvReader.read(file.toString(), in, new HistoryCsvReader.Options(curve, YieldUnit.PERCENT, YieldBounds.DEFAULT),
                    snapshot -> { }, () -> { });
        }
        System.out.println("rows=" + s.rows() + " quotes=" + s.quotes() + " snapshots=" + s.snapshots() + " first=" + s.first() + " last=" + s.last());
    }
}
