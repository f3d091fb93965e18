package org.slopewatch.curve;

import org.slopewatch.text.Excerpt;

/**
 * The basis a yield is quoted on. Notes and bonds are quoted as bond-equivalent yields, bills
 * often as a bank-discount rate; the engine works on the bond-equivalent basis only, so a
 * discount quote is converted ({@link BillConversion}) before it enters a snapshot. Every reader
 * of quotes, JSON and CSV alike, parses the basis and converts through this one type, so that
 * the spellings, the bills it applies to and the conversion cannot drift apart.
 */
public enum YieldBasis {
    BOND_EQUIVALENT("bond-equivalent"),
    DISCOUNT("discount");

    private final String label;

    YieldBasis(String label) {
        this.label = label;
    }

    /** The spelling a quote uses: {@code bond-equivalent} or {@code discount}. */
    public String label() {
        return label;
    }

    /**
     * Parses a basis as a quote spells it, exactly ({@code bond-equivalent}, {@code discount});
     * surrounding blanks are ignored, and null or blank means bond-equivalent, the basis every
     * quote has unless it says otherwise.
     */
    public static YieldBasis parse(String text) {
        if (text == null || text.isBlank()) {
            return BOND_EQUIVALENT;
        }
        String key = text.strip();
        for (YieldBasis basis : values()) {
            if (basis.label.equals(key)) {
                return basis;
            }
        }
        throw new IllegalArgumentException("unknown basis " + Excerpt.quoted(text) + " (accepted: bond-equivalent, discount)");
    }

    /**
     * Checks that a quote of {@code tenor} may be on this basis: a discount rate exists only for
     * bills, which run at most {@link BillConversion#MAX_DAYS} days.
     *
     * @param tenor the tenor as the quote wrote it, whose days the conversion counts
     * @throws IllegalArgumentException naming the tenor when it is no bill
     */
    public void check(Tenor tenor) {
        if (this == DISCOUNT && tenor.days() > BillConversion.MAX_DAYS) {
            throw new IllegalArgumentException("discount basis applies to bills up to 52W, not " + tenor);
        }
    }

    /**
     * A yield in basis points on this basis as a bond-equivalent yield in basis points.
     *
     * @param tenor the tenor as the quote wrote it: its days to maturity are the bill's
     *              ({@link Tenor#days()}: 91 for {@code 13W} and {@code 3M}, 182 for {@code 26W},
     *              364 for {@code 52W})
     * @throws IllegalArgumentException naming the tenor when the tenor is no bill or the rate
     *                                  gives no positive price
     */
    public double toBondEquivalentBp(double bp, Tenor tenor) {
        if (this == BOND_EQUIVALENT) {
            return bp;
        }
        check(tenor);
        try {
            return BillConversion.bondEquivalentBp(bp, tenor.days());
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(tenor + ": " + e.getMessage(), e);
        }
    }
}
