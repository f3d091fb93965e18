package org.slopewatch.history;

import de.siegmar.fastcsv.reader.CsvParseException;
import de.siegmar.fastcsv.reader.CsvReader;
import de.siegmar.fastcsv.reader.CsvRecord;
import de.siegmar.fastcsv.reader.CsvRecordHandler;
import de.siegmar.fastcsv.reader.FieldMismatchStrategy;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.Consumer;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.TenorAliases;
import org.slopewatch.curve.YieldBasis;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.text.Excerpt;

/**
 * Reads yield history from CSV into curve snapshots, each curve's in date order.
 *
 * <p>Two layouts, told apart by the header: wide ({@code date,3M,2Y,10Y,…}, one curve, one row
 * per date, in date order; a heading {@code 13W:discount} declares its column's basis,
 * {@link TenorHeading}) and long ({@code date,curve,tenor,yield} and optionally {@code basis}, in
 * any column order; rows in any order that keeps each curve's dates ascending, such as by date or
 * by curve and date, {@link OpenSnapshots}). Publishers' files are read as published, told apart
 * from these by {@link Layout}: the Treasury's par yield curve ({@link TreasuryHeading}) and the
 * H.15 download ({@link H15Series}) as wide files of their own headings and dates, either
 * direction; SDMX-CSV ({@link SdmxColumns}) gathered whole and placed by a {@link SeriesMap}. A discount basis is converted to bond-equivalent by
 * {@link YieldBasis}, and {@code 13W}, {@code 26W}, {@code 52W} are read as {@code 3M}, {@code 6M},
 * {@code 1Y} ({@link TenorAliases}), as every history file is. Dates are {@code YYYY-MM-DD} or
 * {@code YYYY-MM} (the first of the month). Empty cells and {@code NA}, {@code ND}, {@code .} mark
 * a missing value. The text is UTF-8 (or the charset given), a byte-order mark allowed
 * ({@link CsvText}), CSV as RFC 4180 writes it with any of CR, LF or CR LF ending a line.
 * Anything else that is wrong stops the read with {@code file:line:column: what is wrong}: a
 * report built on half a file would be passed off as whole. Every way the CSV parser (FastCSV)
 * can fail is turned into that here, in {@link #next} and {@link #refused}, so that no caller
 * meets the parser's own exceptions.
 */
public final class HistoryCsvReader {

    /**
     * How to read the values. {@code curve} names the curve of a one-curve file (wide, the
     * Treasury's, H.15); {@code series} places the series of an SDMX-CSV file.
     */
    public record Options(String curve, YieldUnit unit, YieldBounds bounds, SeriesMap series) {
        public Options {
            if (curve == null || curve.isBlank()) {
                throw new IllegalArgumentException("a curve name is needed for a wide file");
            }
            if (series == null) {
                series = SeriesMap.NONE;
            }
        }

        public Options(String curve, YieldUnit unit, YieldBounds bounds) {
            this(curve, unit, bounds, SeriesMap.NONE);
        }
    }

    /** Totals of one read. */
    public record Summary(long rows, long quotes, long snapshots, LocalDate first, LocalDate last) {
    }

    /**
     * The longest field, in characters, and so the longest quoted field spanning lines (an
     * unquoted one ends with its line, {@link CsvText#MAX_LINE}); the parser holds a field whole.
     */
    static final int MAX_FIELD = 1 << 20;
    /** More fields than a line of {@link CsvText#MAX_LINE} characters can hold, so that a long line meets the line limit first. */
    private static final int MAX_FIELDS = CsvText.MAX_LINE + 1;
    private static final int PROGRESS_EVERY_ROWS = 16_384;
    private static final Set<String> LAYOUT_COLUMNS = Set.of("date", "curve", "tenor", "yield", "basis");

    private final String source;
    private final CsvText text;
    private final Options options;
    private final Consumer<CurveSnapshot> sink;
    private final Runnable progress;
    /** The line of the last record the parser handed out; 0 before the first. */
    private long recordLine;
    private long rows;
    private long quotes;
    private long snapshots;
    private LocalDate first;
    private LocalDate last;

    private HistoryCsvReader(String source, CsvText text, Options options, Consumer<CurveSnapshot> sink, Runnable progress) {
        this.source = source;
        this.text = text;
        this.options = options;
        this.sink = sink;
        this.progress = progress;
    }

    /** Reads a UTF-8 stream; see {@link #read(String, InputStream, Charset, Options, Consumer, Runnable)}. */
    public static Summary read(String source, InputStream in, Options options, Consumer<CurveSnapshot> sink,
                               Runnable progress) throws IOException, HistoryFormatException {
        return read(source, in, StandardCharsets.UTF_8, options, sink, progress);
    }

    /**
     * Reads a whole stream, handing each snapshot to {@code sink} as soon as it is complete, each
     * curve's in date order (a long file's curves interleaved as its rows allow, {@link OpenSnapshots});
     * a caller that must take all or nothing collects them until the read returns. The summary's
     * first and last dates are the earliest and latest of any row.
     *
     * @param source   the name used in error messages (usually the file name)
     * @param charset  the text's charset, unless it starts with a byte-order mark (UTF-8, UTF-16), which decides
     * @param progress called every few thousand rows (may be a no-op)
     * @throws HistoryFormatException at the first problem, with its line and column
     * @throws IOException            when the stream cannot be read
     */
    public static Summary read(String source, InputStream in, Charset charset, Options options, Consumer<CurveSnapshot> sink,
                               Runnable progress) throws IOException, HistoryFormatException {
        CsvText text = new CsvText(in, charset);
        HistoryCsvReader reader = new HistoryCsvReader(source, text, options, sink, progress);
        CsvRecordHandler records = CsvRecordHandler.builder().maxFields(MAX_FIELDS).maxFieldSize(MAX_FIELD).maxRecordSize(MAX_FIELD)
                .build();
        // The layouts check the field count of each row themselves, to say where it is wrong; an
        // unclosed quote is an error rather than a field running to the end of the file (FastCSV 4's default).
        try (CsvReader<CsvRecord> csv = CsvReader.builder().skipEmptyLines(true).extraFieldStrategy(FieldMismatchStrategy.IGNORE)
                .missingFieldStrategy(FieldMismatchStrategy.IGNORE).allowUnclosedQuote(false).maxBufferSize(MAX_FIELD)
                .build(records, text)) {
            reader.readAll(csv.iterator());
        }
        return new Summary(reader.rows, reader.quotes, reader.snapshots, reader.first, reader.last);
    }

    /**
     * The next record, or null after the last. Every way the parser can fail ends here: a
     * {@link CsvText.Fault} (not text) arrives wrapped in an {@link UncheckedIOException}, a
     * broken CSV rule or a passed limit as a {@link CsvParseException}, anything else the parser
     * meets as a {@link CsvParseException} with that cause.
     */
    private CsvRecord next(Iterator<CsvRecord> records) throws IOException, HistoryFormatException {
        CsvRecord row;
        try {
            if (!records.hasNext()) {
                return null;
            }
            row = records.next();
        } catch (UncheckedIOException e) {
            if (e.getCause() instanceof CsvText.Fault fault) {
                throw new HistoryFormatException(source, fault.position(), fault.problem());
            }
            throw e.getCause();
        } catch (CsvParseException e) {
            throw refused(e);
        }
        recordLine = row.getStartingLineNumber();
        text.keepFrom(recordLine);
        return row;
    }

    /** The parser refused the record after the last one it handed out: where, and why, as far as the text tells. */
    private HistoryFormatException refused(CsvParseException e) {
        if (e.getCause() instanceof Error error) {
            throw error; // out of memory and the like: nothing to do with the text
        }
        CsvRecordScanner.Finding found = new CsvRecordScanner(text).recordAfter(recordLine);
        String problem = switch (found.kind()) {
            case TEXT_AFTER_QUOTE -> "text after the closing quote of a field: '" + found.character()
                    + "' (a quote inside a quoted field is written twice)";
            case QUOTE_NOT_CLOSED -> text.allSeen() ? "this quote opens a field that is never closed"
                    : String.format(Locale.ROOT, "this quote opens a field longer than %,d characters: is its closing quote missing?",
                    MAX_FIELD);
            case NOTHING -> "the CSV parser refused this record: " + e.getMessage();
        };
        return new HistoryFormatException(source, found.at(), problem + jsonHint(recordLine == 0));
    }

    /** A problem in field {@code field} of {@code row}, placed at the start of that field. */
    private HistoryFormatException at(CsvRecord row, int field, String problem) {
        return new HistoryFormatException(source, new CsvRecordScanner(text).fieldStart(row.getStartingLineNumber(), field), problem);
    }

    private String jsonHint(boolean inHeader) {
        return inHeader && text.looksLikeJson() ? "; the text looks like JSON, not CSV" : "";
    }

    private void readAll(Iterator<CsvRecord> records) throws IOException, HistoryFormatException {
        CsvRecord header = next(records);
        if (header == null) {
            throw new HistoryFormatException(source, 1, 1, "empty file: expected a header 'date,3M,2Y,10Y,…' or 'date,curve,tenor,yield'");
        }
        Layout layout = Layout.of(header.getFields());
        if (layout == Layout.H15) {
            header = h15Header(records, header);
        }
        if (layout == Layout.SDMX) {
            readSdmx(records, header);
            noQuotes();
            return;
        }
        List<String> names = header.getFields().stream().map(f -> f.strip().toLowerCase(Locale.ROOT)).toList();
        if (layout != Layout.H15 && !names.contains("date")) {
            throw at(header, 0, "missing column 'date' in header " + Excerpt.quoted(String.join(",", header.getFields())) + jsonHint(true));
        }
        for (int i = 0; i < names.size(); i++) {
            if (LAYOUT_COLUMNS.contains(names.get(i)) && names.indexOf(names.get(i)) != i) {
                throw at(header, i, "column '" + names.get(i) + "' appears twice in the header");
            }
        }
        if (layout == Layout.LONG) {
            readLong(records, header, names);
        } else {
            readWide(records, header, layout, layout == Layout.H15 ? 0 : names.indexOf("date"));
        }
        noQuotes();
    }

    private void noQuotes() throws HistoryFormatException {
        if (quotes == 0) {
            throw new HistoryFormatException(source, text.end(), rows == 0 ? "no quotes: nothing follows the header"
                    : "no quotes: every value of the " + rows + " rows is missing");
        }
    }

    /**
     * Reads an H.15 download's description rows, from its first, checking each series' unit and
     * multiplier; answers the {@code Time Period} row, the header of the series ({@link H15Series}).
     */
    private CsvRecord h15Header(Iterator<CsvRecord> records, CsvRecord first) throws IOException, HistoryFormatException {
        int n = first.getFieldCount();
        CsvRecord row = first;
        for (int i = 0; ; i++) {
            if (row.getFieldCount() != n) {
                throw at(row, Math.min(n, row.getFieldCount()), "expected " + n + " fields as in the Series Description row, found "
                        + row.getFieldCount());
            }
            String label = row.getField(0);
            if (label.strip().equalsIgnoreCase(H15Series.HEADER_LABEL)) {
                return row;
            }
            if (i >= H15Series.MAX_DESCRIPTION_ROWS) {
                throw at(row, 0, "no 'Time Period' header after " + i + " description rows of an H.15 file");
            }
            for (int j = 1; j < n; j++) {
                String problem = H15Series.checkDescription(label, row.getField(j));
                if (problem != null) {
                    throw at(row, j, problem);
                }
            }
            row = next(records);
            if (row == null) {
                throw new HistoryFormatException(source, text.end(), "the H.15 file ends before its 'Time Period' header: is it cut short?");
            }
        }
    }

    /** A value column's heading in the words of {@code layout}. */
    private static TenorHeading heading(Layout layout, String name) {
        return switch (layout) {
            case TREASURY_PAR -> TreasuryHeading.parse(name);
            case H15 -> H15Series.parse(name);
            default -> TenorHeading.parse(name);
        };
    }

    /**
     * One curve, one row per date, one column per tenor: slopewatch's wide file, and the
     * publishers' files of the same shape. Slopewatch's own dates ascend; a publisher's run one way
     * throughout, either, the Treasury's newest first: a file whose dates descend is held and handed
     * on oldest first when it has been read whole.
     */
    private void readWide(Iterator<CsvRecord> records, CsvRecord header, Layout layout, int dateColumn)
            throws IOException, HistoryFormatException {
        int n = header.getFieldCount();
        TenorHeading[] headings = new TenorHeading[n];
        for (int i = 0; i < n; i++) {
            if (i == dateColumn) {
                continue;
            }
            String name = header.getField(i).strip();
            if (layout == Layout.WIDE && name.equalsIgnoreCase("basis")) {
                throw at(header, i, "a wide file declares the basis in a column's heading, e.g. 13W:discount;"
                        + " a basis column belongs to the long layout date,curve,tenor,yield,basis");
            }
            try {
                headings[i] = heading(layout, name);
            } catch (IllegalArgumentException e) {
                throw at(header, i, e.getMessage());
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
            throw at(header, 0, "no tenor columns: expected a header such as 'date,3M,2Y,10Y'");
        }
        // stable: of two equal tenors the later column comes second
        Arrays.sort(order, (a, b) -> headings[a].tenor().compareTo(headings[b].tenor()));
        Tenor[] sorted = new Tenor[order.length];
        TenorHeading[] columns = new TenorHeading[order.length];
        for (int j = 0; j < order.length; j++) {
            columns[j] = headings[order[j]];
            sorted[j] = columns[j].tenor();
            if (j > 0 && sorted[j].equals(sorted[j - 1])) {
                throw at(header, order[j], "tenor " + sorted[j] + " appears twice in the header"
                        + TenorHeading.aliasNote(columns[j - 1].written()) + TenorHeading.aliasNote(columns[j].written()));
            }
        }
        YieldUnit unit = layout.percentByDefinition() ? YieldUnit.PERCENT : options.unit();
        boolean eitherWay = layout != Layout.WIDE;
        Boolean descending = eitherWay ? null : Boolean.FALSE; // a publisher's direction is its first two dates'
        List<CurveSnapshot> held = new ArrayList<>();
        double[] values = new double[order.length]; // reused: a snapshot copies what it keeps
        LocalDate previous = null;
        CsvRecord row;
        while ((row = next(records)) != null) {
            if (row.getFieldCount() != n) {
                throw at(row, Math.min(n, row.getFieldCount()), "expected " + n + " fields as in the header, found " + row.getFieldCount());
            }
            LocalDate date = layout == Layout.TREASURY_PAR ? usDate(row, dateColumn) : date(row, dateColumn);
            if (previous != null) {
                if (date.equals(previous)) {
                    throw at(row, dateColumn, "date " + date + " appears twice");
                }
                if (descending == null) {
                    descending = date.isBefore(previous);
                }
                if (descending != date.isBefore(previous)) {
                    throw at(row, dateColumn, "dates out of order: " + date + " after " + previous
                            + (eitherWay ? (descending ? " in a file whose dates descend" : " in a file whose dates ascend") : ""));
                }
            }
            previous = date;
            int present = 0;
            for (int j = 0; j < order.length; j++) {
                double v = value(row, order[j], columns[j].written(), columns[j].basis(), unit);
                values[j] = v;
                if (!Double.isNaN(v)) {
                    present++;
                }
            }
            quotes += present;
            noteRow(date);
            if (present > 0) {
                CurveSnapshot snapshot = CurveSnapshot.ofSorted(options.curve(), date, sorted, values);
                if (eitherWay) {
                    held.add(snapshot); // handed on when the direction is known for the whole file, that is at its end
                } else {
                    emit(snapshot);
                }
            }
        }
        if (Boolean.TRUE.equals(descending)) {
            Collections.reverse(held);
        }
        held.forEach(this::emit);
    }

    private void readLong(Iterator<CsvRecord> records, CsvRecord header, List<String> names) throws IOException, HistoryFormatException {
        int dateColumn = names.indexOf("date");
        int curveColumn = column(header, names, "curve");
        int tenorColumn = column(header, names, "tenor");
        int yieldColumn = column(header, names, "yield");
        int basisColumn = names.indexOf("basis"); // optional: bond-equivalent without it
        int needed = Math.max(Math.max(Math.max(dateColumn, curveColumn), Math.max(tenorColumn, yieldColumn)), basisColumn) + 1;
        // A long file repeats the same few strings on every row: each tenor spelling is parsed once,
        // and a date or basis is parsed again only when its text changes from the row before.
        Map<String, TenorCell> tenors = new HashMap<>();
        OpenSnapshots open = new OpenSnapshots(this::emit);
        LocalDate rowDate = null;
        String rowDateText = null;
        YieldBasis basis = YieldBasis.BOND_EQUIVALENT;
        String basisText = null;
        CsvRecord row;
        while ((row = next(records)) != null) {
            if (row.getFieldCount() < needed) {
                throw at(row, row.getFieldCount(), "expected " + names.size() + " fields as in the header, found " + row.getFieldCount());
            }
            String dateText = row.getField(dateColumn);
            LocalDate date = dateText.equals(rowDateText) ? rowDate : date(row, dateColumn);
            rowDate = date;
            rowDateText = dateText;
            String curve = row.getField(curveColumn).strip();
            if (curve.isEmpty()) {
                throw at(row, curveColumn, "missing curve name");
            }
            OpenSnapshots.Curve quotesOf;
            try {
                quotesOf = open.row(curve, date);
            } catch (OpenSnapshots.OutOfOrder e) {
                throw at(row, dateColumn, e.getMessage());
            }
            TenorCell tenor = tenor(tenors, row, tenorColumn);
            if (basisColumn >= 0) {
                String spelt = row.getField(basisColumn);
                if (!spelt.equals(basisText)) {
                    basis = basis(row, basisColumn);
                    basisText = spelt;
                }
                try {
                    basis.check(tenor.written());
                } catch (IllegalArgumentException e) {
                    throw at(row, basisColumn, e.getMessage());
                }
            }
            double v = value(row, yieldColumn, tenor.written(), basis, options.unit());
            noteRow(date);
            if (Double.isNaN(v)) {
                continue;
            }
            if (!open.put(quotesOf, tenor.tenor(), v)) {
                throw at(row, tenorColumn, "second quote for " + Excerpt.of(curve) + " " + tenor.tenor() + " on " + date
                        + TenorHeading.aliasNote(tenor.written()));
            }
            quotes++;
        }
        open.finish();
    }

    /**
     * An SDMX-CSV file: one observation a row, its series named by its dimension cells and placed
     * by the {@link SeriesMap}. A publisher sorts by series and then time, so a curve's dates come
     * round again for each of its tenors: the file is gathered whole, then handed on curve by
     * curve in date order. A second observation of one curve, tenor and date is refused wherever
     * it comes; so is a row that deletes (ACTION {@code D}), since a deletion is no quote.
     */
    private void readSdmx(Iterator<CsvRecord> records, CsvRecord header) throws IOException, HistoryFormatException {
        SdmxColumns columns;
        try {
            columns = SdmxColumns.of(header.getFields());
        } catch (SdmxColumns.Missing e) {
            throw at(header, e.column(), e.getMessage());
        }
        if (options.series().isEmpty()) {
            throw at(header, 0, "an SDMX-CSV file needs a series map to place its series on curves and tenors"
                    + " (replay --series-map FILE, slopewatch.ingest.series-map)");
        }
        Map<String, Map<LocalDate, Map<Tenor, Double>>> curves = new TreeMap<>();
        CsvRecord row;
        StringBuilder key = new StringBuilder();
        while ((row = next(records)) != null) {
            if (row.getFieldCount() != header.getFieldCount()) {
                throw at(row, Math.min(header.getFieldCount(), row.getFieldCount()), "expected " + header.getFieldCount()
                        + " fields as in the header, found " + row.getFieldCount());
            }
            if (columns.action() >= 0 && SdmxColumns.id(row.getField(columns.action())).equalsIgnoreCase("D")) {
                throw at(row, columns.action(), "ACTION D deletes observations: slopewatch reads quotes, not their removal");
            }
            key.setLength(0);
            for (int i = columns.firstDimension(); i < columns.time(); i++) {
                key.append(i > columns.firstDimension() ? "." : "").append(SdmxColumns.id(row.getField(i)));
            }
            SeriesMap.Target target = options.series().target(key.toString());
            if (target == null) {
                throw at(row, columns.firstDimension(), "series " + Excerpt.quoted(key.toString()) + " is not in the series map "
                        + options.series().source());
            }
            LocalDate date = date(row, columns.time());
            // NaN is how SDMX marks an observation without a value (as well as an empty cell)
            double v = row.getField(columns.value()).strip().equals("NaN") ? Double.NaN
                    : value(row, columns.value(), target.written(), YieldBasis.BOND_EQUIVALENT, options.unit());
            noteRow(date);
            if (Double.isNaN(v)) {
                continue;
            }
            Map<Tenor, Double> quotesOf = curves.computeIfAbsent(target.curve(), c -> new TreeMap<>())
                    .computeIfAbsent(date, d -> new TreeMap<>());
            if (quotesOf.putIfAbsent(target.tenor(), v) != null) {
                throw at(row, columns.time(), "second quote for " + Excerpt.of(target.curve()) + " " + target.tenor() + " on " + date
                        + " (series " + key + ")");
            }
            quotes++;
        }
        curves.forEach((curve, dates) -> dates.forEach((date, yields) -> emit(CurveSnapshot.of(curve, date, yields))));
    }

    /** A tenor cell: the tenor as written, whose days a discount rate is converted over, and the point it is read as. */
    private record TenorCell(Tenor written, Tenor tenor) {
    }

    private TenorCell tenor(Map<String, TenorCell> parsed, CsvRecord row, int field) throws HistoryFormatException {
        String spelt = row.getField(field);
        TenorCell tenor = parsed.get(spelt);
        if (tenor == null) {
            Tenor written;
            try {
                written = Tenor.parse(spelt);
            } catch (IllegalArgumentException e) {
                throw at(row, field, e.getMessage());
            }
            tenor = new TenorCell(written, TenorAliases.canonical(written));
            parsed.put(spelt, tenor); // only valid spellings are kept, so the map stays as small as the file's tenors
        }
        return tenor;
    }

    private YieldBasis basis(CsvRecord row, int field) throws HistoryFormatException {
        try {
            return YieldBasis.parse(row.getField(field));
        } catch (IllegalArgumentException e) {
            throw at(row, field, e.getMessage());
        }
    }

    private int column(CsvRecord header, List<String> names, String name) throws HistoryFormatException {
        int column = names.indexOf(name);
        if (column < 0) {
            throw at(header, 0, "missing column " + Excerpt.quoted(name) + ": a long file has columns date,curve,tenor,yield and optionally basis");
        }
        return column;
    }

    /** Counts a row, widens the dates read to it, and reports progress now and then. */
    private void noteRow(LocalDate date) {
        if (first == null || date.isBefore(first)) {
            first = date;
        }
        if (last == null || date.isAfter(last)) {
            last = date;
        }
        if (++rows % PROGRESS_EVERY_ROWS == 0) {
            progress.run();
        }
    }

    private void emit(CurveSnapshot snapshot) {
        snapshots++;
        sink.accept(snapshot);
    }

    private LocalDate date(CsvRecord row, int field) throws HistoryFormatException {
        String spelt = row.getField(field);
        LocalDate d = Dates.parse(spelt);
        if (d == null) {
            throw at(row, field, "unparsable date " + Excerpt.quoted(spelt) + " (expected YYYY-MM-DD or YYYY-MM)");
        }
        return d;
    }

    /** A date as the Treasury writes it, {@code MM/DD/YYYY}. */
    private LocalDate usDate(CsvRecord row, int field) throws HistoryFormatException {
        String spelt = row.getField(field);
        LocalDate d = Dates.parseUs(spelt);
        if (d == null) {
            throw at(row, field, "unparsable date " + Excerpt.quoted(spelt) + " (expected MM/DD/YYYY, as the Treasury writes it)");
        }
        return d;
    }

    /** A cell's yield in basis points on the bond-equivalent basis, or NaN when missing; {@code tenor} as written. */
    private double value(CsvRecord row, int field, Tenor tenor, YieldBasis basis, YieldUnit unit) throws HistoryFormatException {
        String text = row.getField(field);
        String t = text.strip();
        if (t.isEmpty() || t.equals(".") || t.equalsIgnoreCase("NA") || t.equalsIgnoreCase("ND")) {
            return Double.NaN;
        }
        double raw;
        try {
            raw = Double.parseDouble(t);
        } catch (NumberFormatException e) {
            throw at(row, field, "unparsable number " + Excerpt.quoted(text) + " for " + tenor);
        }
        double bp;
        try {
            bp = options.bounds().toBasisPoints(raw, unit);
        } catch (IllegalArgumentException e) {
            throw at(row, field, tenor + ": " + e.getMessage());
        }
        try {
            return basis.toBondEquivalentBp(bp, tenor);
        } catch (IllegalArgumentException e) {
            throw at(row, field, e.getMessage());
        }
    }
}
