package org.slopewatch.probability;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.YearMonth;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import org.slopewatch.text.Excerpt;

/**
 * Reads a recession calendar from CSV: a header line {@code peak,trough}, then one recession a
 * line with both months as {@code YYYY-MM}. Blank lines are ignored. Every error names the
 * source and the line, because these files are kept by hand.
 *
 * <p>A third column, {@code peak_announced} ({@code YYYY-MM-DD}, may be empty), gives the day each
 * peak was made public. It is optional so that a plain chronology of peaks and troughs, as it is
 * usually passed around, reads as it is; when the header names it, every row has three cells.
 */
public final class RecessionCalendarCsv {

    private static final String HEADER = "peak,trough";
    private static final String HEADER_ANNOUNCED = "peak,trough,peak_announced";

    private RecessionCalendarCsv() {
    }

    public static RecessionCalendar read(Path file) {
        try (BufferedReader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return read(in, file.toString());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read recession calendar " + file + ": " + e.getMessage(), e);
        }
    }

    /**
     * @param source the name used in error messages, usually the file path
     * @throws IllegalArgumentException with {@code source:line: problem} for a bad file
     */
    public static RecessionCalendar read(Reader reader, String source) throws IOException {
        BufferedReader in = reader instanceof BufferedReader b ? b : new BufferedReader(reader);
        List<Recession> recessions = new ArrayList<>();
        String line;
        int lineNo = 0;
        boolean headerSeen = false;
        int columns = 2;
        while ((line = in.readLine()) != null) {
            lineNo++;
            String text = stripBom(line, lineNo).strip();
            if (text.isEmpty()) {
                continue;
            }
            if (!headerSeen) {
                String header = text.replace(" ", "");
                if (header.equalsIgnoreCase(HEADER_ANNOUNCED)) {
                    columns = 3;
                } else if (!header.equalsIgnoreCase(HEADER)) {
                    throw error(source, lineNo, "expected the header '" + HEADER + "' or '" + HEADER_ANNOUNCED + "', found "
                            + Excerpt.quoted(text));
                }
                headerSeen = true;
                continue;
            }
            Recession r = parseRow(text, columns, source, lineNo);
            if (!recessions.isEmpty() && r.peak().isBefore(recessions.get(recessions.size() - 1).trough())) {
                throw error(source, lineNo, "peak " + r.peak() + " comes before the previous trough "
                        + recessions.get(recessions.size() - 1).trough()
                        + " (rows must be in time order without overlap)");
            }
            recessions.add(r);
        }
        if (!headerSeen) {
            throw new IllegalArgumentException(source + ": empty file, expected the header '" + HEADER + "'");
        }
        return new RecessionCalendar(recessions);
    }

    private static Recession parseRow(String text, int columns, String source, int lineNo) {
        String[] cells = text.split(",", -1);
        if (cells.length != columns) {
            throw error(source, lineNo, "expected " + columns + " columns '" + (columns == 2 ? HEADER : HEADER_ANNOUNCED) + "', found "
                    + cells.length + ": " + Excerpt.quoted(text));
        }
        YearMonth peak = parseMonth(cells[0].strip(), "peak", source, lineNo);
        YearMonth trough = parseMonth(cells[1].strip(), "trough", source, lineNo);
        if (!trough.isAfter(peak)) {
            throw error(source, lineNo, "trough " + trough + " must come after peak " + peak);
        }
        LocalDate announced = columns == 3 ? parseDay(cells[2].strip(), source, lineNo) : null;
        if (announced != null && !YearMonth.from(announced).isAfter(peak)) {
            throw error(source, lineNo, "peak_announced " + announced + " must come after the peak month " + peak
                    + " (a peak is seen only after it)");
        }
        return new Recession(peak, trough, announced);
    }

    /** An empty cell: the announcement date is not known. */
    private static LocalDate parseDay(String cell, String source, int lineNo) {
        if (cell.isEmpty()) {
            return null;
        }
        if (!cell.matches("\\d{4}-\\d{2}-\\d{2}")) {
            throw error(source, lineNo, "peak_announced " + Excerpt.quoted(cell) + " is not a date in the form YYYY-MM-DD");
        }
        try {
            return LocalDate.parse(cell);
        } catch (DateTimeParseException e) {
            throw error(source, lineNo, "peak_announced " + Excerpt.quoted(cell) + " is not a valid date");
        }
    }

    private static YearMonth parseMonth(String cell, String column, String source, int lineNo) {
        if (cell.isEmpty()) {
            throw error(source, lineNo, column + " is empty (a recession without a dated trough is not supported)");
        }
        // YearMonth.parse also accepts signed and five-digit years; insist on the plain form.
        if (!cell.matches("\\d{4}-\\d{2}")) {
            throw error(source, lineNo, column + " " + Excerpt.quoted(cell) + " is not a month in the form YYYY-MM");
        }
        try {
            return YearMonth.parse(cell);
        } catch (DateTimeParseException e) {
            throw error(source, lineNo, column + " " + Excerpt.quoted(cell) + " is not a valid month");
        }
    }

    private static String stripBom(String line, int lineNo) {
        return lineNo == 1 && line.startsWith("\uFEFF") ? line.substring(1) : line;
    }

    private static IllegalArgumentException error(String source, int lineNo, String message) {
        return new IllegalArgumentException(source + ":" + lineNo + ": " + message);
    }
}
