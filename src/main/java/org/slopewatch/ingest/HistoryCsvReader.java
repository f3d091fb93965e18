package org.slopewatch.ingest;

import de.siegmar.fastcsv.reader.CsvReader;
import de.siegmar.fastcsv.reader.CsvRecord;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.text.Excerpt;

/**
 * Reads yield history from CSV into curve snapshots, in date order.
 *
 * <p>Two layouts, told apart by the header: wide ({@code date,3M,2Y,10Y,…}, one curve, one row
 * per date) and long ({@code date,curve,tenor,yield} in any column order, rows of one date
 * together). Dates are {@code YYYY-MM-DD} or {@code YYYY-MM} (the first of the month). Empty
 * cells and {@code NA}, {@code ND}, {@code .} mark a missing value. Anything else that is wrong
 * stops the read with {@code file:line: what is wrong}: a report built on half a file would be
 * passed off as whole.
 */
public final class HistoryCsvReader {

    /** How to read the values. {@code curve} names the curve of a wide file. */
    public record Options(String curve, YieldUnit unit, YieldBounds bounds) {
        public Options {
            if (curve == null || curve.isBlank()) {
                throw new IllegalArgumentException("a curve name is needed for a wide file");
            }
        }
    }

    /** Totals of one read. */
    public record Summary(long rows, long quotes, long snapshots, LocalDate first, LocalDate last) {
    }

    private static final int PROGRESS_EVERY_ROWS = 16_384;

    private final String source;
    private final Options options;
    private final Consumer<CurveSnapshot> sink;
    private final Runnable progress;
    private long rows;
    private long quotes;
    private long snapshots;
    private LocalDate first;
    private LocalDate last;

    private HistoryCsvReader(String source, Options options, Consumer<CurveSnapshot> sink, Runnable progress) {
        this.source = source;
        this.options = options;
        this.sink = sink;
        this.progress = progress;
    }

    /**
     * Reads a whole stream, handing each snapshot to {@code sink} as soon as its date is complete.
     *
     * @param source   the name used in error messages (usually the file name)
     * @param progress called every few thousand rows (may be a no-op)
     */
    public static Summary read(String source, InputStream in, Options options, Consumer<CurveSnapshot> sink,
                               Runnable progress) throws IOException, HistoryFormatException {
        HistoryCsvReader reader = new HistoryCsvReader(source, options, sink, progress);
        try (CsvReader<CsvRecord> csv = CsvReader.builder().skipEmptyLines(true).allowExtraFields(true)
                .allowMissingFields(true).ofCsvRecord(in)) {
            reader.readAll(csv);
        } catch (UncheckedIOException e) {
            throw e.getCause();
        }
        return new Summary(reader.rows, reader.quotes, reader.snapshots, reader.first, reader.last);
    }

    private void readAll(CsvReader<CsvRecord> csv) throws HistoryFormatException {
        Iterator<CsvRecord> rowsIterator = csv.iterator();
        if (!rowsIterator.hasNext()) {
            throw new HistoryFormatException(source, 1, "empty file: expected a header 'date,3M,2Y,10Y,…' or 'date,curve,tenor,yield'");
        }
        CsvRecord header = rowsIterator.next();
        List<String> names = header.getFields().stream().map(f -> f.strip().toLowerCase(Locale.ROOT)).toList();
        long line = header.getStartingLineNumber();
        if (names.isEmpty() || !names.contains("date")) {
            throw new HistoryFormatException(source, line, "missing column 'date' in header " + header.getFields());
        }
        if (names.contains("curve") || names.contains("tenor") || names.contains("yield")) {
            readLong(rowsIterator, names, line);
        } else {
            readWide(rowsIterator, header.getFields(), line);
        }
    }

    private void readWide(Iterator<CsvRecord> it, List<String> header, long headerLine) throws HistoryFormatException {
        int dateColumn = -1;
        int n = header.size();
        Tenor[] tenors = new Tenor[n];
        for (int i = 0; i < n; i++) {
            String name = header.get(i).strip();
            if (name.equalsIgnoreCase("date")) {
                dateColumn = i;
                continue;
            }
            try {
                tenors[i] = Tenor.parse(name);
            } catch (IllegalArgumentException e) {
                throw new HistoryFormatException(source, headerLine, "column " + (i + 1) + ": " + e.getMessage());
            }
        }
        // the value columns in maturity order, so that each row becomes a sorted snapshot directly
        Integer[] order = new Integer[n - 1];
        for (int i = 0, j = 0; i < n; i++) {
            if (i != dateColumn) {
                order[j++] = i;
            }
        }
        if (order.length == 0) {
            throw new HistoryFormatException(source, headerLine, "no tenor columns: expected a header such as 'date,3M,2Y,10Y'");
        }
        Arrays.sort(order, (a, b) -> tenors[a].compareTo(tenors[b]));
        Tenor[] sorted = new Tenor[order.length];
        for (int j = 0; j < order.length; j++) {
            sorted[j] = tenors[order[j]];
            if (j > 0 && sorted[j].equals(sorted[j - 1])) {
                throw new HistoryFormatException(source, headerLine, "tenor " + sorted[j] + " appears twice in the header");
            }
        }
        double[] values = new double[order.length];
        while (it.hasNext()) {
            CsvRecord row = it.next();
            long line = row.getStartingLineNumber();
            if (row.getFieldCount() != n) {
                throw new HistoryFormatException(source, line, "expected " + n + " fields as in the header, found " + row.getFieldCount());
            }
            LocalDate date = date(row.getField(dateColumn), line);
            if (last != null && !date.isAfter(last)) {
                throw new HistoryFormatException(source, line, date.equals(last)
                        ? "date " + date + " appears twice" : "dates out of order: " + date + " after " + last);
            }
            int present = 0;
            for (int j = 0; j < order.length; j++) {
                double v = value(row.getField(order[j]), line, sorted[j]);
                values[j] = v;
                if (!Double.isNaN(v)) {
                    present++;
                }
            }
            quotes += present;
            noteRow(date);
            if (present > 0) {
                emit(CurveSnapshot.ofSorted(options.curve(), date, sorted, values));
            }
        }
    }

    private void readLong(Iterator<CsvRecord> it, List<String> names, long headerLine) throws HistoryFormatException {
        int dateColumn = names.indexOf("date");
        int curveColumn = column(names, "curve", headerLine);
        int tenorColumn = column(names, "tenor", headerLine);
        int yieldColumn = column(names, "yield", headerLine);
        int needed = Math.max(Math.max(dateColumn, curveColumn), Math.max(tenorColumn, yieldColumn)) + 1;
        // A long file repeats the same few strings on every row: each tenor spelling is parsed once,
        // and a date is parsed again only when its text changes (rows of one date come together).
        Map<String, Tenor> tenors = new HashMap<>();
        Map<String, CurveQuotes> pending = new LinkedHashMap<>();
        LocalDate pendingDate = null;
        String pendingDateText = null;
        while (it.hasNext()) {
            CsvRecord row = it.next();
            long line = row.getStartingLineNumber();
            if (row.getFieldCount() < needed) {
                throw new HistoryFormatException(source, line, "expected " + names.size() + " fields as in the header, found " + row.getFieldCount());
            }
            String dateText = row.getField(dateColumn);
            LocalDate date = dateText.equals(pendingDateText) ? pendingDate : date(dateText, line);
            if (pendingDate != null && date.isBefore(pendingDate)) {
                throw new HistoryFormatException(source, line, "dates out of order: " + date + " after " + pendingDate);
            }
            if (pendingDate != null && date.isAfter(pendingDate)) {
                flush(pending, pendingDate);
            }
            pendingDate = date;
            pendingDateText = dateText;
            String curve = row.getField(curveColumn).strip();
            if (curve.isEmpty()) {
                throw new HistoryFormatException(source, line, "missing curve name");
            }
            Tenor tenor = tenor(tenors, row.getField(tenorColumn), line);
            double v = value(row.getField(yieldColumn), line, tenor);
            noteRow(date);
            if (Double.isNaN(v)) {
                continue;
            }
            if (!pending.computeIfAbsent(curve, c -> new CurveQuotes()).put(tenor, v)) {
                throw new HistoryFormatException(source, line, "second quote for " + Excerpt.of(curve) + " " + tenor + " on " + date);
            }
            quotes++;
        }
        if (pendingDate != null) {
            flush(pending, pendingDate);
        }
    }

    private Tenor tenor(Map<String, Tenor> parsed, String text, long line) throws HistoryFormatException {
        Tenor tenor = parsed.get(text);
        if (tenor == null) {
            try {
                tenor = Tenor.parse(text);
            } catch (IllegalArgumentException e) {
                throw new HistoryFormatException(source, line, e.getMessage());
            }
            parsed.put(text, tenor); // only valid spellings are kept, so the map stays as small as the file's tenors
        }
        return tenor;
    }

    /**
     * One curve's quotes on the pending date, kept in maturity order as they arrive: a pair of
     * arrays rather than a map of boxed values, since a long file makes one per curve and date.
     */
    private static final class CurveQuotes {
        private Tenor[] tenors = new Tenor[16];
        private double[] yieldsBp = new double[16];
        private int size;

        /** Adds a quote in its place by maturity; false if the tenor is already quoted. */
        boolean put(Tenor tenor, double bp) {
            int at = size;
            while (at > 0 && tenors[at - 1].compareTo(tenor) > 0) {
                at--;
            }
            if (at > 0 && tenors[at - 1].compareTo(tenor) == 0) {
                return false;
            }
            if (size == tenors.length) {
                tenors = Arrays.copyOf(tenors, size * 2);
                yieldsBp = Arrays.copyOf(yieldsBp, size * 2);
            }
            System.arraycopy(tenors, at, tenors, at + 1, size - at);
            System.arraycopy(yieldsBp, at, yieldsBp, at + 1, size - at);
            tenors[at] = tenor;
            yieldsBp[at] = bp;
            size++;
            return true;
        }

        CurveSnapshot snapshot(String curve, LocalDate date) {
            return CurveSnapshot.ofSorted(curve, date, Arrays.copyOf(tenors, size), Arrays.copyOf(yieldsBp, size));
        }
    }

    private void flush(Map<String, CurveQuotes> pending, LocalDate date) {
        for (Map.Entry<String, CurveQuotes> e : pending.entrySet()) {
            emit(e.getValue().snapshot(e.getKey(), date));
        }
        pending.clear();
    }

    private int column(List<String> names, String name, long headerLine) throws HistoryFormatException {
        int at = names.indexOf(name);
        if (at < 0) {
            throw new HistoryFormatException(source, headerLine, "missing column " + Excerpt.quoted(name) + ": a long file has columns date,curve,tenor,yield");
        }
        return at;
    }

    /** Counts a row and reports progress now and then. */
    private void noteRow(LocalDate date) {
        if (first == null) {
            first = date;
        }
        last = date;
        if (++rows % PROGRESS_EVERY_ROWS == 0) {
            progress.run();
        }
    }

    private void emit(CurveSnapshot snapshot) {
        snapshots++;
        sink.accept(snapshot);
    }

    private LocalDate date(String text, long line) throws HistoryFormatException {
        LocalDate d = Dates.parse(text);
        if (d == null) {
            throw new HistoryFormatException(source, line, "unparsable date " + Excerpt.quoted(text) + " (expected YYYY-MM-DD or YYYY-MM)");
        }
        return d;
    }

    private double value(String text, long line, Tenor tenor) throws HistoryFormatException {
        String t = text.strip();
        if (t.isEmpty() || t.equals(".") || t.equalsIgnoreCase("NA") || t.equalsIgnoreCase("ND")) {
            return Double.NaN;
        }
        double raw;
        try {
            raw = Double.parseDouble(t);
        } catch (NumberFormatException e) {
            throw new HistoryFormatException(source, line, "unparsable number " + Excerpt.quoted(text) + " for " + tenor);
        }
        try {
            return options.bounds().toBasisPoints(raw, options.unit());
        } catch (IllegalArgumentException e) {
            throw new HistoryFormatException(source, line, tenor + ": " + e.getMessage());
        }
    }

    /** ISO dates without the cost of the general parser, which dominates a large replay otherwise. */
    static final class Dates {
        private Dates() {
        }

        static LocalDate parse(String text) {
            String t = text.strip();
            int len = t.length();
            if ((len != 10 && len != 7) || t.charAt(4) != '-' || (len == 10 && t.charAt(7) != '-')) {
                return null;
            }
            int year = digits(t, 0, 4);
            int month = digits(t, 5, 7);
            int day = len == 10 ? digits(t, 8, 10) : 1;
            if (year < 0 || month < 0 || day < 0) {
                return null;
            }
            try {
                return LocalDate.of(year, month, day);
            } catch (DateTimeException e) {
                return null;
            }
        }

        private static int digits(String t, int from, int to) {
            int v = 0;
            for (int i = from; i < to; i++) {
                char c = t.charAt(i);
                if (c < '0' || c > '9') {
                    return -1;
                }
                v = v * 10 + (c - '0');
            }
            return v;
        }
    }
}
