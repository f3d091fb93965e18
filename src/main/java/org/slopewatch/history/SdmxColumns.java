package org.slopewatch.history;

import java.util.List;
import java.util.Locale;

/**
 * The columns of an SDMX-CSV file, from its header, as the SDMX technical standards lay it out
 * (from memory): version 1.0 opens with {@code DATAFLOW}, version 2.0 with
 * {@code STRUCTURE,STRUCTURE_ID,ACTION}; the dimensions follow in their structure's order, then
 * {@code TIME_PERIOD}, {@code OBS_VALUE} and any attributes. A heading may carry its label after
 * the identifier ({@code FREQ: Frequency}), as a download with labels writes it; the identifier
 * decides.
 *
 * @param firstDimension the first dimension column
 * @param time           the {@code TIME_PERIOD} column
 * @param value          the {@code OBS_VALUE} column
 * @param action         the {@code ACTION} column of version 2.0, or -1
 */
record SdmxColumns(int firstDimension, int time, int value, int action) {

    /** Whether a first record opens an SDMX-CSV file: what recognises the layout. */
    static boolean opens(List<String> fields) {
        if (fields.isEmpty()) {
            return false;
        }
        String first = id(fields.get(0));
        return first.equalsIgnoreCase("DATAFLOW")
                || (first.equalsIgnoreCase("STRUCTURE") && fields.size() > 2 && id(fields.get(1)).equalsIgnoreCase("STRUCTURE_ID"));
    }

    /** The identifier of a heading or a cell, as written, without the label a download may add after a colon. */
    static String id(String cell) {
        String t = cell.strip();
        int colon = t.indexOf(": ");
        return (colon < 0 ? t : t.substring(0, colon)).strip();
    }

    /**
     * The columns of a header.
     *
     * @throws IllegalArgumentException with the column at fault in {@link Missing}
     */
    static SdmxColumns of(List<String> header) {
        boolean v2 = id(header.get(0)).equalsIgnoreCase("STRUCTURE");
        int firstDimension = v2 ? 3 : 1;
        int time = -1;
        int value = -1;
        for (int i = 0; i < header.size(); i++) {
            String id = id(header.get(i)).toUpperCase(Locale.ROOT);
            if (id.equals("TIME_PERIOD")) {
                time = time < 0 ? i : throwTwice(i, id);
            } else if (id.equals("OBS_VALUE")) {
                value = value < 0 ? i : throwTwice(i, id);
            }
        }
        if (v2 && !id(header.get(2)).equalsIgnoreCase("ACTION")) {
            throw new Missing(2, "an SDMX-CSV 2.0 header has ACTION as its third column, found " + header.get(2).strip());
        }
        if (time < 0 || value < 0) {
            throw new Missing(0, "an SDMX-CSV header needs the columns TIME_PERIOD and OBS_VALUE");
        }
        if (time <= firstDimension) {
            throw new Missing(time, "no dimension columns before TIME_PERIOD: the series key is made of them");
        }
        return new SdmxColumns(firstDimension, time, value, v2 ? 2 : -1);
    }

    private static int throwTwice(int column, String id) {
        throw new Missing(column, "column " + id + " appears twice in the header");
    }

    /** A header problem and its column. */
    static final class Missing extends IllegalArgumentException {
        private final int column;

        Missing(int column, String message) {
            super(message);
            this.column = column;
        }

        int column() {
            return column;
        }
    }
}
