package org.slopewatch.delivery;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Severity;

/** Alerts as the rule engine will make them, for the channel tests. */
final class TestAlerts {

    static final String DASHBOARD = "http://localhost:8080/spreads/GOVT-A:10Y-3M";

    private TestAlerts() {
    }

    /** GOVT-A 10Y-3M confirmed after a full quarter inverted, the first notice. */
    static Alert confirmed() {
        return confirmed("govt-a-10y3m/confirmation/2026-03-31/firing/1");
    }

    static Alert confirmed(String id) {
        return new Alert(id, "confirmation", Severity.CRITICAL, Alert.Kind.FIRING, "GOVT-A:10Y-3M", LocalDate.of(2026, 6, 30),
                "CONFIRMED", "[CRITICAL] GOVT-A 10Y-3M CONFIRMED",
                "GOVT-A 10Y-3M has been inverted for the whole of 2026Q2: the quarter average was -18.4 bp, below 0 bp.\n"
                        + "The spell began on 2026-03-31 and has lasted 92 days.\n\n" + Alert.CAUTION,
                List.of(new Alert.Fact("spread", "-21.0 bp"), new Alert.Fact("days inverted", "92"),
                        new Alert.Fact("quarter average", "-18.4 bp (2026Q2)"), new Alert.Fact("spell start", "2026-03-31")),
                DASHBOARD, Instant.parse("2026-06-30T21:05:00Z"));
    }

    /** An alert whose template produced markup, quotes and a line break in every field a person reads. */
    static Alert withMarkup() {
        return new Alert("markup/1", "first-inversion", Severity.INFO, Alert.Kind.REPEAT, "GOVT-B:2Y-3M", LocalDate.of(2026, 2, 2),
                "INVERTED", "[INFO] GOVT-B 2Y-3M <b>INVERTED</b> & \"still\"",
                "Spread <script>alert('x')</script> is -3 bp & falling.\nSecond line.\n\n" + Alert.CAUTION,
                List.of(new Alert.Fact("<i>days</i>", "3 & counting")), "javascript:alert(1)", Instant.parse("2026-02-02T21:00:00Z"));
    }
}
