package org.slopewatch.delivery;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.jboss.logging.Logger;
import org.jboss.logging.MDC;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertText;
import org.slopewatch.rules.Severity;

/**
 * Writes each alert as one structured line, {@code key=value}, to the category
 * {@code org.slopewatch.alerts}; with JSON logs the same fields also travel as MDC keys
 * ({@code alert_id}, {@code alert_rule}, {@code alert_severity}, {@code alert_kind},
 * {@code spread}, {@code market_date}, {@code state}). Informational alerts log at INFO,
 * warnings and critical ones at WARN. Values are quoted when they hold spaces and line breaks
 * are escaped, so that a message template can never forge a second line.
 */
public final class LogChannel implements AlertChannel {

    public static final String TYPE = "log";
    public static final String CATEGORY = "org.slopewatch.alerts";

    private static final Logger LOG = Logger.getLogger(CATEGORY);

    private final String name;

    public LogChannel(String name) {
        this.name = name;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public String type() {
        return TYPE;
    }

    @Override
    public DeliveryOutcome deliver(Alert alert) {
        Map<String, String> mdc = new LinkedHashMap<>();
        mdc.put("alert_id", alert.id());
        mdc.put("alert_rule", alert.rule());
        mdc.put("alert_severity", lower(alert.severity()));
        mdc.put("alert_kind", lower(alert.kind()));
        mdc.put("spread", alert.spreadId());
        mdc.put("market_date", alert.marketDate() == null ? null : alert.marketDate().toString());
        mdc.put("state", alert.state());
        Map<String, Object> previous = new LinkedHashMap<>();
        for (Map.Entry<String, String> e : mdc.entrySet()) {
            if (e.getValue() != null) {
                previous.put(e.getKey(), MDC.put(e.getKey(), e.getValue()));
            }
        }
        try {
            LOG.log(alert.severity() == Severity.INFO ? Logger.Level.INFO : Logger.Level.WARN, line(alert));
        } finally {
            for (Map.Entry<String, Object> e : previous.entrySet()) {
                if (e.getValue() == null) {
                    MDC.remove(e.getKey());
                } else {
                    MDC.put(e.getKey(), e.getValue());
                }
            }
        }
        return new DeliveryOutcome.Delivered("log '" + name + "': written to " + CATEGORY);
    }

    /** The line itself, e.g. {@code alert id=… kind=firing severity=critical rule=… spread=GOVT-A:10Y-3M …}. */
    static String line(Alert a) {
        StringBuilder out = new StringBuilder("alert");
        field(out, "id", a.id());
        field(out, "kind", lower(a.kind()));
        field(out, "severity", lower(a.severity()));
        field(out, "rule", a.rule());
        field(out, "spread", a.spreadId());
        field(out, "market_date", a.marketDate() == null ? null : a.marketDate().toString());
        field(out, "state", a.state());
        field(out, "subject", a.subject());
        if (!a.facts().isEmpty()) {
            StringBuilder facts = new StringBuilder();
            for (Alert.Fact f : a.facts()) {
                facts.append(facts.length() == 0 ? "" : "; ").append(f.label()).append(": ").append(f.value());
            }
            field(out, "facts", facts.toString());
        }
        if (AlertText.hasLink(a)) {
            field(out, "dashboard", a.dashboard());
        }
        return out.toString();
    }

    private static void field(StringBuilder out, String key, String value) {
        if (value == null) {
            return;
        }
        out.append(' ').append(key).append('=').append(quoted(value));
    }

    static String quoted(String value) {
        boolean plain = !value.isEmpty() && value.chars().allMatch(c -> c > ' ' && c != '"' && c != '=' && c != '\\' && c < 127);
        if (plain) {
            return value;
        }
        StringBuilder out = new StringBuilder("\"");
        for (int i = 0; i < value.length(); i++) {
            char c = value.charAt(i);
            switch (c) {
                case '"' -> out.append("\\\"");
                case '\\' -> out.append("\\\\");
                case '\n' -> out.append("\\n");
                case '\r' -> out.append("\\r");
                case '\t' -> out.append("\\t");
                default -> out.append(c);
            }
        }
        return out.append('"').toString();
    }

    private static String lower(Enum<?> e) {
        return e.name().toLowerCase(Locale.ROOT);
    }

    @Override
    public String toString() {
        return "LogChannel[" + name + "]";
    }
}
