package org.slopewatch.history;

import java.util.List;
import java.util.Locale;

/**
 * The layouts a history file comes in, and the one rule that tells them apart from the file's
 * first record, so that no option is needed to read a publisher's file as it is published.
 *
 * <ul>
 *   <li>{@link #SDMX}: SDMX-CSV 1.0 ({@code DATAFLOW,…}) or 2.0 ({@code STRUCTURE,STRUCTURE_ID,ACTION,…}),
 *       its series placed by a {@link SeriesMap} ({@link SdmxColumns}).</li>
 *   <li>{@link #H15}: the Federal Reserve's H.15 data download, whose first record is the
 *       {@code Series Description} row above the {@code Time Period} header ({@link H15Series}).</li>
 *   <li>{@link #LONG}: slopewatch's {@code date,curve,tenor,yield[,basis]}.</li>
 *   <li>{@link #TREASURY_PAR}: the U.S. Treasury's daily par yield curve, {@code Date,"1 Mo",…,"30 Yr"}
 *       ({@link TreasuryHeading}); one heading in the Treasury's words is enough, a wrong other
 *       heading is then refused at its column.</li>
 *   <li>{@link #WIDE}: slopewatch's {@code date,3M,2Y,10Y,…}; anything else is read as this and
 *       refused at the first heading that is no tenor.</li>
 * </ul>
 */
enum Layout {
    WIDE, LONG, TREASURY_PAR, H15, SDMX;

    /** The layout whose first record {@code fields} is, as written (blanks and case ignored). */
    static Layout of(List<String> fields) {
        List<String> names = fields.stream().map(f -> f.strip().toLowerCase(Locale.ROOT)).toList();
        if (!names.isEmpty() && H15Series.DESCRIPTION_LABEL.equalsIgnoreCase(names.get(0))) {
            return H15;
        }
        if (SdmxColumns.opens(fields)) {
            return SDMX;
        }
        if (names.contains("curve") || names.contains("tenor") || names.contains("yield")) {
            return LONG;
        }
        if (names.stream().anyMatch(TreasuryHeading::looksLikeOne)) {
            return TREASURY_PAR;
        }
        return WIDE;
    }

    /** Whether the values are in percent whatever {@code --unit} says: the publisher's layout states it. */
    boolean percentByDefinition() {
        return this == TREASURY_PAR || this == H15;
    }
}
