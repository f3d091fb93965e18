package org.slopewatch.curve;

import java.util.Map;

/**
 * The bill tenors that history files may spell in weeks for the month or year point they stand
 * for: the 13-, 26- and 52-week bills are a desk's 3-month, 6-month and 1-year yields, and spreads
 * such as {@code 10Y-3M} are defined on the latter. Without the alias a file of {@code 13W} rates
 * would quote no {@code 3M} at all, and the spread would go uncomputed.
 *
 * <p>The alias changes where a quote sits on the curve, never how its basis is converted: a
 * discount rate is converted over the days of the tenor as written ({@link YieldBasis}), 182 for
 * {@code 26W} and 364 for {@code 52W}, the bills' own terms.
 */
public final class TenorAliases {

    /** Written tenor to the tenor it is read as; the one table every history reader uses. */
    private static final Map<Tenor, Tenor> ALIASES = Map.of(
            Tenor.weeks(13), Tenor.months(3),
            Tenor.weeks(26), Tenor.months(6),
            Tenor.weeks(52), Tenor.years(1));

    private TenorAliases() {
    }

    /** The tenor {@code written} is read as: its alias, or itself. */
    public static Tenor canonical(Tenor written) {
        return ALIASES.getOrDefault(written, written);
    }

    /** Whether {@code written} is read as another tenor. */
    public static boolean isAlias(Tenor written) {
        return ALIASES.containsKey(written);
    }
}
