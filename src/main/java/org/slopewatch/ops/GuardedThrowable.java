package org.slopewatch.ops;

import java.util.IdentityHashMap;
import java.util.Map;
import java.util.function.UnaryOperator;

/**
 * A copy of a thrown exception for a log record, its message cleaned by the {@link LogGuard}:
 * it prints as the original would ({@code ClassName: message}, the same frames, causes and
 * suppressed exceptions), with every message passed through the guard.
 */
final class GuardedThrowable extends RuntimeException {

    private final String className;

    private GuardedThrowable(String className, String message) {
        // the cause is left unset here so that copy() can set it; the frames are the original's
        super(message);
        this.className = className;
    }

    @Override
    public synchronized Throwable fillInStackTrace() {
        return this;
    }

    static Throwable of(Throwable original, UnaryOperator<String> clean) {
        return copy(original, clean, new IdentityHashMap<>());
    }

    private static Throwable copy(Throwable t, UnaryOperator<String> clean, Map<Throwable, Throwable> copies) {
        Throwable done = copies.get(t);
        if (done != null) {
            return done;
        }
        GuardedThrowable g = new GuardedThrowable(t.getClass().getName(), clean.apply(t.getMessage()));
        copies.put(t, g);
        g.setStackTrace(t.getStackTrace());
        if (t.getCause() != null && t.getCause() != t) {
            g.initCause(copy(t.getCause(), clean, copies));
        }
        for (Throwable s : t.getSuppressed()) {
            g.addSuppressed(copy(s, clean, copies));
        }
        return g;
    }

    /** The original's class name, as a stack trace names it. */
    String originalClassName() {
        return className;
    }

    @Override
    public String toString() {
        String message = getLocalizedMessage();
        return message == null ? className : className + ": " + message;
    }
}
