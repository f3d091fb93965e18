package org.slopewatch.bench;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.LocalDate;
import java.util.Locale;
import java.util.Random;

/**
 * Writes the input of the replay-against-pandas benchmark: a long CSV {@code date,curve,tenor,yield}
 * of 50 invented curves ({@code GOVT-01} … {@code GOVT-50}) over 40 years of business days
 * (1986-01-01 to 2025-12-31), 8 tenors each (3M, 6M, 1Y, 2Y, 3Y, 5Y, 10Y, 30Y), yields in percent
 * with two decimals, the rows of one date together (as {@code HistoryCsvReader} wants them).
 *
 * <p>Curve k (from 0) starts 3·k calendar days after 1986-01-01 (the last on 1986-05-28), so that
 * some curves start in the first month of a quarter and report it while others start in its second
 * or third month and must not (the engine's rule, which the pandas side has to follow too). Each curve's 3-month yield
 * is a mean-reverting walk around 4.5 % and its 10-year yield the 3-month plus a {@link SpreadWalk},
 * as in {@link HistoryFileGenerator}; the other tenors lie on a smooth curve through those two.
 * Deterministic: the same arguments give the same bytes.
 */
public final class CurvesHistoryGenerator {

    static final int CURVES = 50;
    static final LocalDate FIRST = LocalDate.of(1986, 1, 1);
    static final LocalDate LAST = LocalDate.of(2025, 12, 31);
    static final String[] TENORS = {"3M", "6M", "1Y", "2Y", "3Y", "5Y", "10Y", "30Y"};
    private static final double[] YEARS = {0.25, 0.5, 1, 2, 3, 5, 10, 30};
    static final long SEED = 19860101L;
    static final int STAGGER_DAYS = 3;

    private CurvesHistoryGenerator() {
    }

    /** Usage: {@code CurvesHistoryGenerator FILE [CURVES]}. Writes to a temporary file first, so a half-written file never remains. */
    public static void main(String[] args) throws IOException {
        if (args.length < 1) {
            System.err.println("usage: CurvesHistoryGenerator FILE [CURVES]");
            System.exit(2);
        }
        Path file = Path.of(args[0]);
        int curves = args.length > 1 ? Integer.parseInt(args[1]) : CURVES;
        Path dir = file.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = Files.createTempFile(dir, file.getFileName().toString(), ".part");
        long rows;
        try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.US_ASCII)) {
            rows = write(w, curves);
        }
        Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING);
        System.out.println("wrote " + file + ": " + curves + " curves, " + rows + " rows (quotes), " + Files.size(file) + " bytes");
    }

    static long write(Writer w, int curves) throws IOException {
        double[] shape = new double[YEARS.length];
        for (int i = 0; i < YEARS.length; i++) {
            shape[i] = (HistoryFileGenerator.rise(YEARS[i]) - HistoryFileGenerator.rise(0.25))
                    / (HistoryFileGenerator.rise(10) - HistoryFileGenerator.rise(0.25));
        }
        String[] names = new String[curves];
        SpreadWalk[] spreads = new SpreadWalk[curves];
        Random[] shortRates = new Random[curves];
        double[] shortBp = new double[curves];
        LocalDate[] starts = new LocalDate[curves];
        for (int k = 0; k < curves; k++) {
            names[k] = String.format(Locale.ROOT, "GOVT-%02d", k + 1);
            spreads[k] = new SpreadWalk(SEED + k);
            shortRates[k] = new Random(SEED + 1000 + k);
            shortBp[k] = 450;
            starts[k] = FIRST.plusDays((long) STAGGER_DAYS * k);
        }
        StringBuilder line = new StringBuilder(64);
        w.write("date,curve,tenor,yield\n");
        long rows = 0;
        LocalDate day = SpreadWalk.isBusinessDay(FIRST) ? FIRST : SpreadWalk.nextBusinessDay(FIRST);
        while (!day.isAfter(LAST)) {
            String date = day.toString();
            for (int k = 0; k < curves; k++) {
                if (day.isBefore(starts[k])) {
                    continue;
                }
                shortBp[k] = Math.abs(shortBp[k] + 0.001 * (450 - shortBp[k]) + 6 * shortRates[k].nextGaussian());
                double s = spreads[k].next();
                for (int t = 0; t < TENORS.length; t++) {
                    line.setLength(0);
                    line.append(date).append(',').append(names[k]).append(',').append(TENORS[t]).append(',');
                    HistoryFileGenerator.appendPercent(line, Math.round(shortBp[k] + shape[t] * s));
                    w.write(line.append('\n').toString());
                    rows++;
                }
            }
            day = SpreadWalk.nextBusinessDay(day);
        }
        return rows;
    }
}
