package org.slopewatch.probability;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Loads the files under src/test/resources/reference (provenance in the README there). */
final class ReferenceFiles {

    static final String YIELDS = "us-cmt-monthly-1953-1999.csv";
    static final String CYCLES = "us-business-cycle-dates.csv";
    static final String PROBIT_R = "probit-10y1y-h12.csv";

    private ReferenceFiles() {
    }

    static Path path(String name) {
        URL url = ReferenceFiles.class.getResource("/reference/" + name);
        if (url == null) {
            throw new IllegalStateException("missing test resource reference/" + name);
        }
        try {
            return Path.of(url.toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    /**
     * The 10Y − 1Y spread of each month of the Treasury file, one observation per month dated on
     * the first (the file's values are already monthly averages).
     */
    static List<SpreadObservation> tenYearMinusOneYear() {
        List<SpreadObservation> out = new ArrayList<>();
        List<String> lines = lines(YIELDS);
        if (!lines.get(0).equals("date,1Y,3Y,5Y,10Y")) {
            throw new IllegalStateException("unexpected header in " + YIELDS + ": " + lines.get(0));
        }
        for (String line : lines.subList(1, lines.size())) {
            if (line.isBlank()) {
                continue;
            }
            String[] c = line.split(",");
            out.add(new SpreadObservation(LocalDate.parse(c[0]),
                    Double.parseDouble(c[4]) - Double.parseDouble(c[1])));
        }
        return out;
    }

    static RecessionCalendar nberCalendar() {
        return RecessionCalendarCsv.read(path(CYCLES));
    }

    /** The quantity,value rows of the stored R output; '#' lines are its provenance header. */
    static Map<String, Double> probitReference() {
        Map<String, Double> out = new LinkedHashMap<>();
        for (String line : lines(PROBIT_R)) {
            if (line.startsWith("#") || line.isBlank() || line.equals("quantity,value")) {
                continue;
            }
            String[] c = line.split(",");
            out.put(c[0], Double.parseDouble(c[1]));
        }
        return out;
    }

    private static List<String> lines(String name) {
        try {
            return Files.readAllLines(path(name), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
