package org.slopewatch.replay;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.time.YearMonth;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import org.slopewatch.ingest.HistoryFormatException;
import org.slopewatch.probability.Recession;

/** Reads business-cycle dates: a CSV with header {@code peak,trough} and {@code YYYY-MM} months. */
public final class RecessionDatesCsv {

    private RecessionDatesCsv() {
    }

    public static List<Recession> read(String source, Reader in) throws IOException, HistoryFormatException {
        List<Recession> out = new ArrayList<>();
        BufferedReader lines = new BufferedReader(in);
        String header = lines.readLine();
        if (header == null || !header.strip().replace(" ", "").equalsIgnoreCase("peak,trough")) {
            throw new HistoryFormatException(source, 1, "expected the header 'peak,trough', found '" + header + "'");
        }
        int lineNo = 1;
        YearMonth previous = null;
        for (String line = lines.readLine(); line != null; line = lines.readLine()) {
            lineNo++;
            if (line.isBlank()) {
                continue;
            }
            String[] f = line.split(",", -1);
            if (f.length != 2) {
                throw new HistoryFormatException(source, lineNo, "expected 2 fields 'peak,trough', found " + f.length);
            }
            YearMonth peak = month(f[0], source, lineNo);
            YearMonth trough = month(f[1], source, lineNo);
            if (!trough.isAfter(peak)) {
                throw new HistoryFormatException(source, lineNo, "trough " + trough + " must come after peak " + peak);
            }
            if (previous != null && !peak.isAfter(previous)) {
                throw new HistoryFormatException(source, lineNo, "peak " + peak + " must come after the previous trough " + previous);
            }
            previous = trough;
            out.add(new Recession(peak, trough));
        }
        return out;
    }

    private static YearMonth month(String text, String source, int line) throws HistoryFormatException {
        try {
            return YearMonth.parse(text.strip());
        } catch (DateTimeParseException e) {
            throw new HistoryFormatException(source, line, "unparsable month '" + text.strip() + "' (expected YYYY-MM)");
        }
    }
}
