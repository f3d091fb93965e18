package org.slopewatch.history;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBasis;
import org.slopewatch.text.Excerpt;

/**
 * The Federal Reserve's H.15 data download, as its Data Download Program writes a CSV: description
 * rows, one cell per series after a label, then the {@code Time Period} header whose cells are the
 * series' identifiers, then one row per date, {@code ND} where there is no data (from memory):
 *
 * <pre>
 * "Series Description","Market yield on U.S. Treasury securities at 3-month   constant maturity, quoted on investment basis",…
 * "Unit:","Percent:_Per_Year",…
 * "Multiplier:","1",…
 * "Currency:","NA",…
 * "Unique Identifier: ","H15/H15/RIFLGFCM03_N.B",…
 * "Time Period","RIFLGFCM03_N.B",…
 * 2024-01-02,5.46,…
 * </pre>
 *
 * <p>A column's tenor comes from its identifier: the nominal constant-maturity yields
 * {@code RIFLGFCMnn_N.f} ({@code nn} months) and {@code RIFLGFCYnn_N.f} ({@code nn} years), with
 * {@code f} the frequency ({@code B} business day, {@code M} month, …); for example
 * {@code RIFLGFCM03_N.B} is 3 months and {@code RIFLGFCY10_N.B} 10 years (from memory). Any other
 * series is refused, a real yield or a money-market rate read as a Treasury point being worse than
 * no reading. The yields are on an investment (bond-equivalent) basis.
 */
final class H15Series {

    /** The label of the first description row, which recognises the layout. */
    static final String DESCRIPTION_LABEL = "series description";
    /** The label of the header row, whose cells are the series' identifiers. */
    static final String HEADER_LABEL = "time period";
    /** Description rows the layout has; more before the header and the file is no H.15 download. */
    static final int MAX_DESCRIPTION_ROWS = 8;

    private static final Pattern IDENTIFIER = Pattern.compile("(?:H15/H15/)?RIFLGFC([MY])(\\d{2})_N\\.[A-Z]{1,3}");

    private H15Series() {
    }

    /**
     * The tenor of the series an identifier names.
     *
     * @throws IllegalArgumentException naming the identifier when it is no nominal constant-maturity series
     */
    static TenorHeading parse(String identifier) {
        Matcher m = IDENTIFIER.matcher(identifier.strip());
        if (!m.matches()) {
            throw new IllegalArgumentException("series " + Excerpt.quoted(identifier)
                    + " is no Treasury constant-maturity yield (expected identifiers such as RIFLGFCM03_N.B, RIFLGFCY10_N.B)");
        }
        int n = Integer.parseInt(m.group(2));
        try {
            Tenor tenor = m.group(1).equals("M") ? Tenor.months(n) : Tenor.years(n);
            return new TenorHeading(tenor, YieldBasis.BOND_EQUIVALENT);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("series " + Excerpt.quoted(identifier) + ": " + e.getMessage());
        }
    }

    /**
     * Checks a description row's cell for a series: the unit must be percent and the multiplier 1,
     * since the reader takes the values as percent.
     *
     * @return a problem, or null when the cell is as expected or its row is not checked
     */
    static String checkDescription(String label, String cell) {
        String l = label.strip().toLowerCase(Locale.ROOT);
        String c = cell.strip();
        if (l.startsWith("unit") && !c.toLowerCase(Locale.ROOT).startsWith("percent")) {
            return "unit " + Excerpt.quoted(cell) + ": only percent is read";
        }
        if (l.startsWith("multiplier") && !c.equals("1")) {
            return "multiplier " + Excerpt.quoted(cell) + ": only 1 is read";
        }
        return null;
    }
}
