package org.slopewatch.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.probability.CovarianceKind;
import org.slopewatch.probability.FitOptions;
import org.slopewatch.probability.MonthlyAverage;
import org.slopewatch.probability.MonthlyAverager;
import org.slopewatch.probability.ProbitFit;
import org.slopewatch.probability.ProbitFitException;
import org.slopewatch.probability.ProbitFitter;
import org.slopewatch.probability.RecessionCalendar;
import org.slopewatch.probability.RecessionCalendarCsv;
import org.slopewatch.replay.FitReport;
import org.slopewatch.replay.SpreadSeries;
import org.slopewatch.replay.SpreadSeriesReader;
import org.slopewatch.spread.SpreadDefinition;
import org.slopewatch.text.Excerpt;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code slopewatch fit FILE}: the probit recession model fitted to a spread's history. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Fits P(recession in month m+h) = Phi(alpha + beta * s_m) by maximum likelihood, s_m the calendar-month "
                + "average of a spread in percentage points, and reports both model-based and Newey-West standard errors, "
                + "goodness of fit and probability bands.",
                "Refit on the desk's own data before using the coefficients in a policy."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:fit reported", "1:could not read a file",
                "2:bad input or options, or data that cannot give a fit (separation, one class, too few months)"})
final class FitCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "FILE", description = "History CSV in the replay's layouts: wide 'date,3M,2Y,10Y,…' or long 'date,curve,tenor,yield', or as published: Treasury par yields, H.15, SDMX-CSV (docs/replay.md).")
    Path file;

    @Option(names = "--spread", required = true, paramLabel = "SPREAD", description = "The spread, e.g. 10Y-3M, 10Y-1Y or 10Y-3M~ (interpolated legs).")
    String spread;

    @Option(names = "--recessions", required = true, paramLabel = "FILE", description = "Business-cycle dates, CSV 'peak,trough' (YYYY-MM), optionally ',peak_announced' (YYYY-MM-DD, not used by the fit).")
    Path recessions;

    @Option(names = "--horizon-months", required = true, paramLabel = "H", description = "Target: recession in month m+H (12 is the literature's usual choice).")
    int horizonMonths;

    @Option(names = "--lag", paramLabel = "L", description = "Newey-West lag in months (default: the horizon, since targets less than H months apart overlap).")
    Integer lag;

    @Option(names = "--covariance", paramLabel = "KIND", defaultValue = "newey-west", description = "Covariance for the probability bands: model or newey-west (default: ${DEFAULT-VALUE}).")
    String covariance;

    @Option(names = "--grid", paramLabel = "PP", split = ",", description = "Spreads (percentage points) at which to show P and its 90%% band (default: -2,-1,0,1,2,3).")
    List<Double> grid;

    @Option(names = "--curve", paramLabel = "NAME", description = "The curve to fit in a long file with several curves.")
    String curve;

    @Mixin
    HistoryReading reading = new HistoryReading();


    @Option(names = "--json", description = "Write the report as JSON.")
    boolean json;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        try {
            SpreadDefinition definition = SpreadDefinition.parse(spread);
            CovarianceKind bandKind = covarianceKind(covariance);
            FitOptions options = FitOptions.horizon(horizonMonths);
            if (lag != null) {
                options = options.withHacLag(lag);
            }
            RecessionCalendar calendar;
            try (Reader r = Files.newBufferedReader(recessions, StandardCharsets.UTF_8)) {
                calendar = RecessionCalendarCsv.read(r, recessions.toString());
            }
            HistoryCsvReader.Options read = reading.options(curve != null ? curve : fileStem());
            SpreadSeries series;
            try (InputStream in = Files.newInputStream(file)) {
                series = SpreadSeriesReader.read(file.toString(), in, read, definition, curve);
            }
            List<MonthlyAverage> months = MonthlyAverager.average(series.observations());
            ProbitFit fit = new ProbitFitter(options).fit(months, calendar);
            FitReport report = FitReport.of(series, months, recessions.toString(), calendar, fit, bandKind,
                    FitReport.DEFAULT_LEVEL, grid == null || grid.isEmpty() ? FitReport.DEFAULT_GRID : grid);
            if (json) {
                ReportJson.write(report, out);
            } else {
                new FitText(out).print(report);
            }
            return 0;
        } catch (ProbitFitException e) {
            err.printf(Locale.ROOT, "slopewatch fit: cannot fit %s on %s (%s): %s%n", spread, file,
                    e.reason().name().toLowerCase(Locale.ROOT).replace('_', ' '), e.getMessage());
            return 2;
        } catch (HistoryFormatException e) {
            err.println(e.getMessage());
            return 2;
        } catch (IllegalArgumentException e) {
            // the readers' messages already start with the file they are about
            String m = e.getMessage();
            boolean located = m.startsWith(file + ":") || m.startsWith(recessions + ":");
            err.println(located ? m : "slopewatch fit: " + m);
            return 2;
        } catch (NoSuchFileException e) {
            err.println("slopewatch fit: no such file: " + e.getFile());
            return 1;
        } catch (IOException e) {
            err.println("slopewatch fit: cannot read: " + e.getMessage());
            return 1;
        }
    }

    private static CovarianceKind covarianceKind(String text) {
        return switch (text.strip().toLowerCase(Locale.ROOT)) {
            case "model", "model-based" -> CovarianceKind.MODEL_BASED;
            case "newey-west" -> CovarianceKind.NEWEY_WEST;
            default -> throw new IllegalArgumentException("unknown covariance " + Excerpt.quoted(text) + " (known: model, newey-west)");
        };
    }

    private String fileStem() {
        String name = file.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }
}
