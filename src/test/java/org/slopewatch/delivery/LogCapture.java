package org.slopewatch.delivery;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.logging.Handler;
import java.util.logging.Level;
import java.util.logging.LogRecord;
import java.util.logging.Logger;
import org.jboss.logmanager.ExtLogRecord;

/**
 * Captures log records while it is open: the formatted message, the MDC and the full stack trace
 * of anything thrown. {@link #of} watches the given categories (down to the finest level) as
 * logged; {@link #everything} and {@link #channels} watch every logger, slopewatch's and every
 * library's, and see each record as the console writes it: after the console handler's filter
 * (the log guard that masks secrets and escapes line breaks).
 */
public final class LogCapture implements AutoCloseable {

    /** One captured record. */
    public record Line(String category, Level level, String message, Map<String, String> mdc, String thrown) {

        /** Everything a reader of the log could see. */
        public String all() {
            return category + " " + level + " " + message + " " + mdc + " " + thrown;
        }
    }

    /** The root logger, to which {@link #everything} attaches. */
    private static final String ROOT = "";

    private final List<Line> lines = new CopyOnWriteArrayList<>();
    private final List<Logger> loggers = new ArrayList<>();
    private final List<Level> previousLevels = new ArrayList<>();
    private final Handler handler = new Handler() {
        @Override
        public void publish(LogRecord r) {
            if (!isLoggable(r)) {
                return;
            }
            String message;
            Map<String, String> mdc = Map.of();
            if (r instanceof ExtLogRecord ext) {
                message = ext.getFormattedMessage();
                mdc = ext.getMdcCopy();
            } else {
                message = new java.util.logging.SimpleFormatter().formatMessage(r);
            }
            String thrown = "";
            if (r.getThrown() != null) {
                StringWriter trace = new StringWriter();
                r.getThrown().printStackTrace(new PrintWriter(trace));
                thrown = trace.toString();
            }
            lines.add(new Line(r.getLoggerName(), r.getLevel(), message, mdc, thrown));
        }

        @Override
        public void flush() {
        }

        @Override
        public void close() {
        }
    };

    private LogCapture() {
        handler.setLevel(Level.ALL);
    }

    public static LogCapture of(String... categories) {
        LogCapture capture = new LogCapture();
        for (String category : categories) {
            Logger logger = Logger.getLogger(category);
            capture.loggers.add(logger);
            capture.previousLevels.add(logger.getLevel());
            logger.setLevel(Level.ALL);
            logger.addHandler(capture.handler);
        }
        return capture;
    }

    /**
     * Every logger at the levels configured, except the given categories, which are set to the
     * finest level; each record as the console handler lets it through (its filter applied).
     */
    public static LogCapture everything(String... finest) {
        LogCapture capture = new LogCapture();
        capture.handler.setFilter(consoleFilter());
        Logger root = Logger.getLogger(ROOT);
        capture.loggers.add(root);
        capture.previousLevels.add(root.getLevel());
        root.addHandler(capture.handler);
        for (String category : finest) {
            Logger logger = Logger.getLogger(category);
            capture.loggers.add(logger);
            capture.previousLevels.add(logger.getLevel());
            logger.setLevel(Level.ALL);
        }
        return capture;
    }

    /**
     * What the channel tests watch: every logger, as the console writes it; slopewatch itself, the
     * mailer and the SMTP client down to the finest level, as an operator chasing a problem might
     * set them, including the SMTP client's authentication logger, which application.properties
     * keeps quiet; the JDK HTTP client stays at the level the application pins (its debug output
     * prints request URLs; see {@code quarkus.log.category."jdk.internal.httpclient"}).
     */
    static LogCapture channels() {
        return everything("org.slopewatch", "io.quarkus.mailer", "io.vertx.ext.mail", "io.vertx.ext.mail.impl.SMTPAuthentication");
    }

    /**
     * The filter of the console handler Quarkus set up, which every record passes before the
     * console writes it; null when it has none (then records are written as logged).
     */
    private static java.util.logging.Filter consoleFilter() {
        return consoleFilter(Logger.getLogger(ROOT).getHandlers());
    }

    private static java.util.logging.Filter consoleFilter(Handler[] handlers) {
        for (Handler h : handlers) {
            if (h instanceof org.jboss.logmanager.handlers.ConsoleHandler console) {
                return console.getFilter();
            }
            if (h instanceof org.jboss.logmanager.ExtHandler ext) {
                java.util.logging.Filter inner = consoleFilter(ext.getHandlers());
                if (inner != null) {
                    return inner;
                }
            }
        }
        return null;
    }

    public List<Line> lines() {
        return List.copyOf(lines);
    }

    @Override
    public void close() {
        for (int i = 0; i < loggers.size(); i++) {
            loggers.get(i).removeHandler(handler);
            loggers.get(i).setLevel(previousLevels.get(i));
        }
    }
}
