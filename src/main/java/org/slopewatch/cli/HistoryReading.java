package org.slopewatch.cli;

import java.io.IOException;
import java.nio.file.Path;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.SeriesMap;
import picocli.CommandLine.Option;

/**
 * How the offline commands (replay, fit, backfill) read history files: the unit of the yields and,
 * for SDMX-CSV, the map placing each series; one set of options, so that they read alike.
 */
final class HistoryReading {

    @Option(names = "--series-map", paramLabel = "FILE", description = "For SDMX-CSV: lines KEY,CURVE,TENOR placing each series (see docs/sdmx.md).")
    Path seriesMap;

    @Option(names = "--unit", paramLabel = "UNIT", defaultValue = "percent", description = "Unit of the yields: percent, bp or decimal (default: ${DEFAULT-VALUE}).")
    String unit = "percent";

    /** The reader's options for a file whose quotes name no curve, {@code curve} being the one they belong to. */
    HistoryCsvReader.Options options(String curve) throws IOException {
        return new HistoryCsvReader.Options(curve, YieldUnit.parse(unit), YieldBounds.DEFAULT, SeriesMap.readOrNone(seriesMap));
    }
}
