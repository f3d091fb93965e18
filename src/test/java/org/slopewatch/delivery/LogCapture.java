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
 * Captures every record of the given log categories, down to the finest level, while it is open:
 * the formatted message, the MDC and the full stack trace of anything thrown.
 */
public final class LogCapture implements AutoCloseable {

    /** One captured record. */
    public record Line(String category, Level level, String message, Map<String, String> mdc, String thrown) {

        /** Everything a reader of the log could see. */
        public String all() {
            return category + " " + level + " " + message + " " + mdc + " " + thrown;
        }
    }

    private final List<Line> lines = new CopyOnWriteArrayList<>();
    private final List<Logger> loggers = new ArrayList<>();
    private final List<Level> previousLevels = new ArrayList<>();
    private final Handler handler = new Handler() {
        @Override
        public void publish(LogRecord r) {
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
     * What the channel tests watch: slopewatch itself, the mailer and the SMTP client down to the
     * finest level, as an operator chasing a problem might set them, and the JDK HTTP client at
     * the level the application configures for it (its debug output prints request URLs, so
     * application.properties pins it; see {@code quarkus.log.category."jdk.internal.httpclient"}).
     */
    static LogCapture channels() {
        LogCapture capture = of("org.slopewatch", "io.quarkus.mailer", "io.vertx.ext.mail");
        Logger jdkClient = Logger.getLogger("jdk.internal.httpclient");
        capture.loggers.add(jdkClient);
        capture.previousLevels.add(jdkClient.getLevel());
        jdkClient.addHandler(capture.handler);
        return capture;
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
