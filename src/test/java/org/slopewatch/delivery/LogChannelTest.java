package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;

import org.jboss.logging.MDC;
import org.junit.jupiter.api.Test;

/** The log channel writes one structured line per alert, with the same fields as MDC keys. */
class LogChannelTest {

    @Test
    void oneKeyValueLineWithMdcKeys() {
        LogChannel channel = new LogChannel("log");
        LogCapture.Line line;
        DeliveryOutcome outcome;
        try (LogCapture logs = LogCapture.of(LogChannel.CATEGORY)) {
            outcome = channel.deliver(TestAlerts.confirmed());
            assertThat(logs.lines()).as("exactly one line per alert").hasSize(1);
            line = logs.lines().get(0);
        }

        assertThat(outcome).isEqualTo(new DeliveryOutcome.Delivered("log 'log': written to org.slopewatch.alerts"));
        assertThat(line.message()).isEqualTo("alert id=govt-a-10y3m/confirmation/2026-03-31/opening/1 kind=opening severity=critical "
                + "rule=confirmation spread=GOVT-A:10Y-3M market_date=2026-06-30 state=CONFIRMED "
                + "subject=\"GOVT-A:10Y-3M confirmed inverted at -21.0 bp \u2014 opening notice, critical\" "
                + "facts=\"spread: -21.0 bp; days inverted: 92; quarter average: -18.4 bp (2026Q2); spell start: 2026-03-31\" "
                + "dashboard=" + TestAlerts.DASHBOARD);
        assertThat(line.level()).as("critical alerts log at WARN").isEqualTo(org.jboss.logmanager.Level.WARN);
        assertThat(line.mdc()).containsEntry("alert_id", "govt-a-10y3m/confirmation/2026-03-31/opening/1")
                .containsEntry("alert_rule", "confirmation").containsEntry("alert_severity", "critical")
                .containsEntry("alert_kind", "opening").containsEntry("spread", "GOVT-A:10Y-3M")
                .containsEntry("market_date", "2026-06-30").containsEntry("state", "CONFIRMED");
        assertThat(MDC.get("alert_id")).as("the MDC is cleaned up after the line").isNull();
    }

    @Test
    void aTemplateCannotForgeASecondLine() {
        LogCapture.Line line;
        try (LogCapture logs = LogCapture.of(LogChannel.CATEGORY)) {
            new LogChannel("log").deliver(TestAlerts.withMarkup());
            line = logs.lines().get(0);
        }

        assertThat(line.message()).doesNotContain("\n")
                .contains("subject=\"GOVT-B:2Y-3M still <b>inverted</b> & \\\"still\\\" \u2014 standing notice, info\"")
                .as("a dashboard link that is not http(s) is left out").doesNotContain("javascript:");
        assertThat(line.level()).as("informational alerts log at INFO").isEqualTo(org.jboss.logmanager.Level.INFO);
    }

    @Test
    void valuesAreQuotedOnlyWhenNeeded() {
        assertThat(LogChannel.quoted("GOVT-A:10Y-3M")).isEqualTo("GOVT-A:10Y-3M");
        assertThat(LogChannel.quoted("two words")).isEqualTo("\"two words\"");
        assertThat(LogChannel.quoted("a=b")).isEqualTo("\"a=b\"");
        assertThat(LogChannel.quoted("line\nbreak \"q\" back\\slash")).isEqualTo("\"line\\nbreak \\\"q\\\" back\\\\slash\"");
        assertThat(LogChannel.quoted("")).isEqualTo("\"\"");
    }
}
