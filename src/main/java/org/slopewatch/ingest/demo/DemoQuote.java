package org.slopewatch.ingest.demo;

import java.time.LocalDate;
import org.slopewatch.curve.Tenor;

/** One yield of the demo scenario: a curve's tenor on a market date, in basis points, bond-equivalent. */
public record DemoQuote(String curve, Tenor tenor, LocalDate date, double yieldBp) {

    /** The yield in percent, the quote message's default unit. */
    public double yieldPercent() {
        return yieldBp / 100;
    }
}
