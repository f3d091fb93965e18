package org.slopewatch.ingest.demo;

/**
 * Bond-equivalent yield of a zero-coupon price, the basis the engine holds every yield on.
 *
 * <p>With {@code P} the price per unit of face value and {@code t} the maturity in years (a
 * 365-day year), the conventions follow the Treasury's for bills and notes:
 * <pre>
 * t ≤ 1/2:      simple interest       BEY = (1/P − 1)/t
 * 1/2 &lt; t &lt; 1:  one coupon and a stub  P·(1 + (t − 1/2)·BEY)·(1 + BEY/2) = 1
 * t ≥ 1:        semiannual compounding BEY = 2·(P^(−1/(2t)) − 1)
 * </pre>
 * The middle form equals the simple one at {@code t = 1/2} and the compounded one at {@code t = 1},
 * so the yield is continuous in maturity. It is the form {@link org.slopewatch.curve.BillConversion}
 * uses for bills, so a converted bill quote and a model yield agree on what a bill yields.
 */
final class BondEquivalent {

    private static final double HALF_YEAR = 0.5;

    private BondEquivalent() {
    }

    /** The bond-equivalent yield (decimal) of a price per unit of face for maturity {@code years}. */
    static double fromPrice(double price, double years) {
        if (!(price > 0) || !Double.isFinite(price)) {
            throw new IllegalArgumentException("price must be positive and finite, got " + price);
        }
        if (!(years > 0) || !Double.isFinite(years)) {
            throw new IllegalArgumentException("maturity must be positive and finite, got " + years);
        }
        if (years <= HALF_YEAR) {
            return (1 / price - 1) / years;
        }
        if (years < 1) {
            // (t − 1/2)/2·r² + t·r + (1 − 1/P) = 0; its positive root written as −2c/(t + √(t² − 4ac)),
            // which stays accurate as t approaches 1/2 and the quadratic term vanishes
            double a = (years - HALF_YEAR) / 2;
            double c = 1 - 1 / price;
            return -2 * c / (years + StrictMath.sqrt(years * years - 4 * a * c));
        }
        return 2 * (StrictMath.pow(price, -1 / (2 * years)) - 1);
    }
}
