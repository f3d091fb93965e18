package org.slopewatch.bench;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.LocalDate;
import java.util.Random;

/**
 * Writes the replay benchmark's input: a wide CSV {@code date,1M,3M,…,30Y} of one curve, one row
 * per business day from 1962-01-02, yields in percent with two decimals (as the Federal Reserve
 * publishes them). 500,000 rows of 10 tenors are 5,000,000 quotes. Deterministic: the same
 * arguments give the same bytes.
 *
 * <p>The 3-month yield is a mean-reverting walk around 4.5 %; the 10-year is the 3-month plus a
 * {@link SpreadWalk}, so 10Y-3M inverts now and then; the other tenors lie on a smooth curve
 * through those two.
 */
public final class HistoryFileGenerator {

    static final String[] TENORS = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "30Y"};
    private static final double[] YEARS = {1.0 / 12, 0.25, 0.5, 1, 2, 3, 5, 7, 10, 30};
    static final int ROWS = 500_000;
    static final long QUOTES = (long) ROWS * TENORS.length;
    static final long SEED = 3_10_2024L;

    private HistoryFileGenerator() {
    }

    /** Usage: {@code HistoryFileGenerator FILE [ROWS]}. Writes to a temporary file first, so a half-written file never remains. */
    public static void main(String[] args) throws IOException {
        if (args.length < 1) {
            System.err.println("usage: HistoryFileGenerator FILE [ROWS]");
            System.exit(2);
        }
        Path file = Path.of(args[0]);
        int rows = args.length > 1 ? Integer.parseInt(args[1]) : ROWS;
        Path dir = file.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = Files.createTempFile(dir, file.getFileName().toString(), ".part");
        try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.US_ASCII)) {
            write(w, rows);
        }
        Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING);
        System.out.println("wrote " + file + ": " + rows + " rows, " + (long) rows * TENORS.length + " quotes, "
                + Files.size(file) + " bytes");
    }

    static void write(Writer w, int rows) throws IOException {
        // a shape that is 0 at 3M and 1 at 10Y: the curve's slope is carried entirely by the spread
        double[] shape = new double[YEARS.length];
        for (int i = 0; i < YEARS.length; i++) {
            shape[i] = (rise(YEARS[i]) - rise(0.25)) / (rise(10) - rise(0.25));
        }
        SpreadWalk spread = new SpreadWalk(SEED);
        Random shortRate = new Random(SEED + 1);
        double shortBp = 450;
        LocalDate day = LocalDate.of(1962, 1, 2);
        StringBuilder line = new StringBuilder(128);
        line.append("date");
        for (String t : TENORS) {
            line.append(',').append(t);
        }
        w.write(line.append('\n').toString());
        for (int r = 0; r < rows; r++) {
            shortBp += 0.001 * (450 - shortBp) + 6 * shortRate.nextGaussian();
            shortBp = Math.abs(shortBp); // reflect at zero
            double s = spread.next();
            line.setLength(0);
            line.append(day);
            for (double k : shape) {
                line.append(',');
                appendPercent(line, Math.round(shortBp + k * s));
            }
            w.write(line.append('\n').toString());
            day = SpreadWalk.nextBusinessDay(day);
        }
    }

    static double rise(double years) {
        return 1 - Math.exp(-years / 2);
    }

    /** Whole basis points as percent with two decimals: 431 → 4.31, -7 → -0.07. */
    static void appendPercent(StringBuilder b, long bp) {
        if (bp < 0) {
            b.append('-');
            bp = -bp;
        }
        b.append(bp / 100).append('.');
        long cents = bp % 100;
        if (cents < 10) {
            b.append('0');
        }
        b.append(cents);
    }
}
