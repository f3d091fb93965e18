package org.slopewatch.curve;

/**
 * How the fit gets e^(−t/τ) at each quoted maturity t, for any τ, with as few calls of
 * {@link Math#exp} as the maturities allow: a maturity that is the sum of two earlier ones
 * (2Y = 1Y + 1Y, 3Y = 1Y + 2Y, 30Y = 10Y + 20Y…) takes the product of their exponentials.
 *
 * <p>Why: the exponentials are about half the cost of one evaluation of the fit's sum of squares
 * (two per maturity for a Svensson curve), and the common tenor sets are built from a few short
 * maturities by sums. Only sums that are exact in floating point are used. A product carries its
 * factors' rounding errors, so a maturity m times the shortest one computed is off by up to about
 * m units in the last place (8e-14 relative for 30Y built from 1M), an absolute error below 1e-13
 * in a loading, the precision {@link NssProfile#loading} already allows and far below anything a fit
 * can show (ExponentialsTest).
 *
 * <p>A function of the maturities alone and immutable, kept with the decay grid of its tenor set
 * ({@link DecayGrid}).
 */
final class Exponentials {

    private final double[] years;
    // for maturity i: the two earlier maturities it is the sum of, or -1 when it takes Math.exp
    private final int[] left;
    private final int[] right;

    private Exponentials(double[] years, int[] left, int[] right) {
        this.years = years;
        this.left = left;
        this.right = right;
    }

    /** The plan for maturities {@code years} (in any order; a maturity can only use earlier ones). */
    static Exponentials of(double[] years) {
        int n = years.length;
        int[] left = new int[n];
        int[] right = new int[n];
        for (int i = 0; i < n; i++) {
            left[i] = -1;
            right[i] = -1;
            search:
            for (int j = 0; j < i; j++) {
                for (int k = j; k < i; k++) {
                    if (years[j] + years[k] == years[i]) {
                        left[i] = j;
                        right[i] = k;
                        break search;
                    }
                }
            }
        }
        return new Exponentials(years.clone(), left, right);
    }

    /** How many maturities take {@link Math#exp}; the rest are products. */
    int calls() {
        int calls = 0;
        for (int l : left) {
            calls += l < 0 ? 1 : 0;
        }
        return calls;
    }

    /** e^(−t·inverseTau) for each maturity t into {@code out}. */
    void fill(double inverseTau, double[] out) {
        for (int i = 0; i < years.length; i++) {
            int l = left[i];
            out[i] = l < 0 ? Math.exp(-years[i] * inverseTau) : out[l] * out[right[i]];
        }
    }
}
