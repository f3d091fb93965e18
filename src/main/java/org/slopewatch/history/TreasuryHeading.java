package org.slopewatch.history;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBasis;
import org.slopewatch.text.Excerpt;

/**
 * A maturity column of the U.S. Treasury's daily par yield curve CSV, as the Treasury heads it:
 * {@code 1 Mo}, {@code 2 Mo}, {@code 3 Mo}, {@code 4 Mo}, {@code 6 Mo}, {@code 1 Yr}, {@code 2 Yr},
 * … {@code 30 Yr}, and {@code 1.5 Month} for the six-week bill (these spellings from memory). Par
 * yields are on the bond-equivalent basis, so the column needs no basis of its own.
 */
final class TreasuryHeading {

    /** A count, a space, a unit; the fraction only as the six-week bill's {@code 1.5}. */
    private static final Pattern SYNTAX = Pattern.compile("(\\d{1,2}(?:\\.5)?) ?(wk|wks|week|weeks|mo|mos|month|months|yr|yrs|year|years)");

    private TreasuryHeading() {
    }

    /** Whether {@code heading} is written the Treasury's way, a count and a unit apart: what recognises the layout. */
    static boolean looksLikeOne(String heading) {
        return SYNTAX.matcher(heading.strip().toLowerCase(Locale.ROOT)).matches() && heading.strip().indexOf(' ') > 0;
    }

    /**
     * The tenor of a heading.
     *
     * @throws IllegalArgumentException naming the heading when it is no maturity of the Treasury's
     */
    static TenorHeading parse(String heading) {
        Matcher m = SYNTAX.matcher(heading.strip().toLowerCase(Locale.ROOT));
        if (!m.matches()) {
            throw new IllegalArgumentException("unknown maturity " + Excerpt.quoted(heading)
                    + " in a Treasury par yield file (expected headings such as '1 Mo', '3 Mo', '10 Yr')");
        }
        String count = m.group(1);
        char unit = m.group(2).charAt(0);
        Tenor tenor;
        if (count.endsWith(".5")) {
            if (!count.equals("1.5") || unit != 'm') {
                throw new IllegalArgumentException("unknown maturity " + Excerpt.quoted(heading)
                        + " in a Treasury par yield file: of fractions only '1.5 Month' (the six-week bill) is known");
            }
            tenor = Tenor.weeks(6);
        } else {
            int n = Integer.parseInt(count);
            tenor = switch (unit) {
                case 'w' -> Tenor.weeks(n);
                case 'm' -> Tenor.months(n);
                default -> Tenor.years(n);
            };
        }
        return new TenorHeading(tenor, YieldBasis.BOND_EQUIVALENT);
    }
}
