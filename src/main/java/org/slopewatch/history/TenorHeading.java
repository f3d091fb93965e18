package org.slopewatch.history;

import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.TenorAliases;
import org.slopewatch.curve.YieldBasis;

/**
 * A value column of a wide file, as its heading declares it: {@code TENOR} or
 * {@code TENOR:BASIS}, such as {@code 10Y} or {@code 13W:discount}. The basis is what a JSON
 * quote's {@code basis} takes ({@link YieldBasis}), bond-equivalent unless the heading says
 * otherwise; the tenor is read through {@link TenorAliases}, so {@code 13W} is the 3M point.
 *
 * @param written the tenor as the heading writes it, whose days a discount rate is converted over
 * @param basis   the basis of the column's values
 */
record TenorHeading(Tenor written, YieldBasis basis) {

    /** Separates the tenor from the basis in a heading. */
    static final char BASIS_MARK = ':';

    /**
     * Reads a heading.
     *
     * @throws IllegalArgumentException naming what is wrong: an unknown tenor or basis, or a
     *                                  discount basis on a tenor that is no bill
     */
    static TenorHeading parse(String heading) {
        int mark = heading.indexOf(BASIS_MARK);
        Tenor written = Tenor.parse(mark < 0 ? heading : heading.substring(0, mark));
        YieldBasis basis = mark < 0 ? YieldBasis.BOND_EQUIVALENT : YieldBasis.parse(nonBlank(heading.substring(mark + 1)));
        basis.check(written);
        return new TenorHeading(written, basis);
    }

    /** The point of the curve the column quotes. */
    Tenor tenor() {
        return TenorAliases.canonical(written);
    }

    /** What a message adds when the written tenor stands for another: {@code " (13W is read as 3M)"}. */
    static String aliasNote(Tenor written) {
        return TenorAliases.isAlias(written) ? " (" + written + " is read as " + TenorAliases.canonical(written) + ")" : "";
    }

    /** A mark with nothing after it is a mistake, not the default basis. */
    private static String nonBlank(String basis) {
        if (basis.isBlank()) {
            throw new IllegalArgumentException("nothing after '" + BASIS_MARK + "': write the basis, e.g. 13W:discount");
        }
        return basis;
    }
}
