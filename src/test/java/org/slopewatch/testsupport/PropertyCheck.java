package org.slopewatch.testsupport;

import java.util.function.Consumer;

/**
 * Runs a property over random samples on plain JUnit 5: each try draws its sample from a
 * {@link java.util.SplittableRandom} seeded with the run's seed plus the try's number, so a
 * failure names the one seed that makes its sample again. {@code -Dproperty.seed=S} starts a
 * run at seed S (the failing try then comes first); {@code -Dfuzz.tries=N} gives the fuzz
 * properties N tries instead of the suite's number (see {@link #fuzzTries(int)}).
 */
public final class PropertyCheck {

    static final String SEED = "property.seed";
    static final String FUZZ_TRIES = "fuzz.tries";
    private static final int SHOWN = 2_000;

    private PropertyCheck() {
    }

    /** The suite's number of tries for a fuzz property, or {@code -Dfuzz.tries} for a longer run. */
    public static int fuzzTries(int suiteTries) {
        String tries = System.getProperty(FUZZ_TRIES);
        return tries == null || tries.isBlank() ? suiteTries : Integer.parseInt(tries.strip());
    }

    /** Checks {@code property} on {@code tries} samples of {@code gen}; the first failure stops the run and says how to repeat it. */
    public static <T> void forAll(int tries, Gen<T> gen, Consumer<T> property) {
        String given = System.getProperty(SEED);
        long first = given == null || given.isBlank() ? new java.util.SplittableRandom().nextLong() : Long.parseLong(given.strip());
        for (int i = 0; i < tries; i++) {
            long seed = first + i;
            T sample = gen.next(new java.util.SplittableRandom(seed));
            try {
                property.accept(sample);
            } catch (AssertionError | RuntimeException e) {
                throw new AssertionError("property failed on try " + (i + 1) + " of " + tries + " with seed " + seed
                        + " (repeat with -D" + SEED + "=" + seed + ")\nsample: " + shown(sample) + "\n" + e.getMessage(), e);
            }
        }
    }

    private static String shown(Object sample) {
        String text = sample instanceof byte[] b ? java.util.HexFormat.of().formatHex(b) : String.valueOf(sample);
        return text.length() <= SHOWN ? text : text.substring(0, SHOWN) + "… (" + text.length() + " characters)";
    }
}
