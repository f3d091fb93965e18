package org.slopewatch.web;

import de.siegmar.fastcsv.writer.CsvWriter;
import de.siegmar.fastcsv.writer.LineDelimiter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;

/**
 * RFC 4180 CSV: the header row first (no comment or preamble, so a spreadsheet reads it as
 * column names), CRLF line ends, fields quoted when they hold a comma, a quote or a line break.
 * Empty for null and for a value that is not a finite number.
 */
final class CsvTableWriter implements TableWriter {

    private final CsvWriter csv;
    private final String[] fields;

    CsvTableWriter(OutputStream out, List<String> columns) {
        // FastCSV's defaults are RFC 4180's: comma, double quote, quoting only where required
        this.csv = CsvWriter.builder().lineDelimiter(LineDelimiter.CRLF).build(new OutputStreamWriter(out, StandardCharsets.UTF_8));
        this.fields = new String[columns.size()];
        csv.writeRecord(columns);
    }

    @Override
    public void row(Object[] values) {
        for (int i = 0; i < values.length; i++) {
            fields[i] = text(values[i]);
        }
        csv.writeRecord(fields);
    }

    @Override
    public void finish() throws IOException {
        csv.flush();
    }

    static String text(Object v) {
        if (v == null) {
            return "";
        }
        if (v instanceof Double d) {
            return Double.isFinite(d) ? d.toString() : "";
        }
        return v.toString();
    }
}
