package org.slopewatch.testsupport;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Function;

/**
 * A generator of random test input for {@link PropertyCheck}, drawn from a seeded
 * {@link SplittableRandom} so that any sample can be made again from its seed. Sizes and bounds
 * come up more often than uniform chance would give them (an empty list, the longest string, the
 * smallest number), because that is where parsers and state machines break.
 */
@FunctionalInterface
public interface Gen<T> {

    T next(SplittableRandom random);

    default <R> Gen<R> map(Function<? super T, ? extends R> f) {
        return r -> f.apply(next(r));
    }

    /** Lists of this generator's values, of {@code min} to {@code max} elements. */
    default Gen<List<T>> list(int min, int max) {
        return r -> {
            int size = size(r, min, max);
            List<T> out = new ArrayList<>(size);
            for (int i = 0; i < size; i++) {
                out.add(next(r));
            }
            return out;
        };
    }

    /** Whole numbers from {@code min} to {@code max}, both included; each bound one time in twenty. */
    static Gen<Integer> ints(int min, int max) {
        return r -> {
            int pick = r.nextInt(20);
            return pick == 0 ? min : pick == 1 ? max : (int) r.nextLong(min, (long) max + 1);
        };
    }

    /** Numbers from {@code min} to {@code max} with at most {@code scale} decimals. */
    static Gen<Double> doubles(double min, double max, int scale) {
        return r -> {
            int pick = r.nextInt(20);
            double x = pick == 0 ? min : pick == 1 ? max : pick == 2 ? Math.max(min, Math.min(max, 0.0)) : r.nextDouble(min, max);
            return BigDecimal.valueOf(x).setScale(scale, RoundingMode.HALF_EVEN).doubleValue();
        };
    }

    @SafeVarargs
    static <T> Gen<T> of(T... values) {
        return of(Arrays.asList(values));
    }

    static <T> Gen<T> of(List<T> values) {
        List<T> copy = List.copyOf(values);
        return r -> copy.get(r.nextInt(copy.size()));
    }

    static <E extends Enum<E>> Gen<E> of(Class<E> type) {
        return of(type.getEnumConstants());
    }

    /** One of the generators, each as likely. */
    @SafeVarargs
    static <T> Gen<T> oneOf(Gen<? extends T>... choices) {
        return r -> choices[r.nextInt(choices.length)].next(r);
    }

    /** {@code first} {@code firstWeight} times in {@code firstWeight + secondWeight}, else {@code second}. */
    static <T> Gen<T> frequency(int firstWeight, Gen<? extends T> first, int secondWeight, Gen<? extends T> second) {
        return r -> r.nextInt(firstWeight + secondWeight) < firstWeight ? first.next(r) : second.next(r);
    }

    /** Any UTF-16 text up to {@code maxLength} chars: control characters, lone surrogates and all. */
    static Gen<String> strings(int maxLength) {
        return r -> {
            int length = size(r, 0, maxLength);
            StringBuilder s = new StringBuilder(length);
            for (int i = 0; i < length; i++) {
                // half from the first 256 (where syntax lives), half from all of UTF-16
                s.append((char) (r.nextBoolean() ? r.nextInt(256) : r.nextInt(Character.MAX_VALUE + 1)));
            }
            return s.toString();
        };
    }

    /** Text of the given characters only, up to {@code maxLength}. */
    static Gen<String> strings(String chars, int maxLength) {
        return r -> {
            int length = size(r, 0, maxLength);
            StringBuilder s = new StringBuilder(length);
            for (int i = 0; i < length; i++) {
                s.append(chars.charAt(r.nextInt(chars.length())));
            }
            return s.toString();
        };
    }

    static Gen<String> alphanumeric(int maxLength) {
        return strings("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789", maxLength);
    }

    static Gen<byte[]> bytes(int maxSize) {
        return r -> {
            byte[] b = new byte[size(r, 0, maxSize)];
            r.nextBytes(b);
            return b;
        };
    }

    /** A subset of {@code values} of at least {@code min} elements, in their order. */
    static <T> Gen<List<T>> subsetOf(List<T> values, int min) {
        List<T> copy = List.copyOf(values);
        return r -> {
            List<T> out = new ArrayList<>();
            while (out.size() < min) {
                out.clear();
                for (T v : copy) {
                    if (r.nextBoolean()) {
                        out.add(v);
                    }
                }
            }
            return out;
        };
    }

    /** A size from {@code min} to {@code max}: each bound one time in ten, otherwise uniform. */
    private static int size(SplittableRandom r, int min, int max) {
        int pick = r.nextInt(10);
        return pick == 0 ? min : pick == 1 ? max : r.nextInt(min, max + 1);
    }
}
