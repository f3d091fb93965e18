package org.slopewatch.curve;

import java.util.Arrays;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The {@link DecayGrid}s built so far, one per set of quoted maturities, so that a grid's
 * yield-free work is done once per tenor set rather than once per snapshot.
 *
 * <p>A feed quotes a handful of tenor sets (one per curve, a few more on days a tenor is
 * missing), so the cache is small; it is bounded all the same, since the maturities come from
 * outside: past {@link #MAX_GRIDS} it is emptied and refills with the sets in use. A grid is a
 * function of the maturities alone and is immutable, so which thread builds it, or whether it is
 * built twice, changes nothing.
 */
final class DecayGrids {

    static final int MAX_GRIDS = 64;

    private static final ConcurrentHashMap<Maturities, DecayGrid> GRIDS = new ConcurrentHashMap<>();

    private DecayGrids() {
    }

    /** The grid of maturities {@code years}, between the bounds on ln τ the fit uses for them. */
    static DecayGrid of(double[] years, boolean svensson) {
        Maturities key = new Maturities(years.clone(), svensson);
        DecayGrid grid = GRIDS.get(key);
        if (grid != null) {
            return grid;
        }
        if (GRIDS.size() >= MAX_GRIDS) {
            GRIDS.clear();
        }
        // The bounds on ln τ are a function of the maturities (NssProfile), so the key need not hold them.
        return GRIDS.computeIfAbsent(key,
                k -> new DecayGrid(k.years, NssProfile.lowestLogTau(k.years), NssProfile.highestLogTau(), svensson));
    }

    /** How many grids are kept now; for tests of the bound. */
    static int size() {
        return GRIDS.size();
    }

    /** Maturities compared by value, bit for bit. */
    private static final class Maturities {
        private final double[] years;
        private final boolean svensson;
        private final int hash;

        Maturities(double[] years, boolean svensson) {
            this.years = years;
            this.svensson = svensson;
            this.hash = 31 * Arrays.hashCode(years) + Boolean.hashCode(svensson);
        }

        @Override
        public boolean equals(Object other) {
            return other instanceof Maturities m && m.svensson == svensson && Arrays.equals(m.years, years);
        }

        @Override
        public int hashCode() {
            return hash;
        }
    }
}
