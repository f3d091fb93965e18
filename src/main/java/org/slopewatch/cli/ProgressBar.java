package org.slopewatch.cli;

import java.io.PrintStream;
import java.util.Locale;

/**
 * A one-line progress bar on stderr, drawn only when stderr is a terminal (the launcher tells us
 * through {@code -Dslopewatch.progress=true}) so that logs and pipes stay clean.
 */
final class ProgressBar implements AutoCloseable {

    private static final int WIDTH = 30;
    private static final long MIN_REDRAW_NANOS = 200_000_000L;

    private final PrintStream out;
    private final String label;
    private final long total;
    private final String unit;
    private long lastDraw;
    private boolean drawn;

    private ProgressBar(PrintStream out, String label, long total, String unit) {
        this.out = out;
        this.label = label;
        this.total = total;
        this.unit = unit;
    }

    /** A bar on stderr counting bytes if it is a terminal, otherwise one that draws nothing. */
    static ProgressBar forStderr(String label, long total) {
        return forStderr(label, total, "bytes");
    }

    /** A bar on stderr counting {@code unit} (a plural noun) if it is a terminal, otherwise one that draws nothing. */
    static ProgressBar forStderr(String label, long total, String unit) {
        boolean enabled = Boolean.getBoolean("slopewatch.progress") && total > 0;
        return new ProgressBar(enabled ? System.err : null, label, total, unit);
    }

    void update(long done) {
        if (out == null) {
            return;
        }
        long now = System.nanoTime();
        if (drawn && now - lastDraw < MIN_REDRAW_NANOS) {
            return;
        }
        lastDraw = now;
        drawn = true;
        double share = Math.min(1.0, (double) done / total);
        int filled = (int) Math.round(share * WIDTH);
        out.print(String.format(Locale.ROOT, "\r%s [%s%s] %3.0f%%  %,d of %,d %s", label, "=".repeat(filled),
                " ".repeat(WIDTH - filled), 100 * share, done, total, unit));
        out.flush();
    }

    @Override
    public void close() {
        if (out != null && drawn) {
            out.print("\r" + " ".repeat(WIDTH + label.length() + unit.length() + 48) + "\r");
            out.flush();
        }
    }
}
