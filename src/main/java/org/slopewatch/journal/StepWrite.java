package org.slopewatch.journal;

import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.function.Function;

/**
 * The journal's side of one processing step, written while the step is still being decided. As
 * long as the step is small it only waits: {@link #finish} writes it whole on the caller's thread
 * ({@link JournalWriter#write}). Once it has {@code aheadRows} quote and spread-value rows, they
 * are handed to the journal's writer thread, which opens the step's transaction and inserts them
 * while the caller decides the next messages on the other core; each further part goes the same
 * way, and {@link #finish} hands over the rest (conclusions, notices) and returns once the
 * transaction is committed and on disk. Nothing is visible to anyone before that commit, so a step
 * is still all or nothing: {@link #abandon}, or a failure on either side, rolls it back.
 */
public final class StepWrite {

    /** The parts the writer thread may hold before the caller waits: bounds the memory of a slow journal. */
    private static final int PARTS_WAITING = 4;

    /** What the writer thread takes: a part of the step's rows, the rest of the step, or the order to give up. */
    sealed interface Part permits Rows, Rest, Abandon {
    }

    record Rows(JournalEntries entries) implements Part {
    }

    record Rest(JournalEntries entries) implements Part {
    }

    record Abandon() implements Part {
    }

    private final JournalWriter writer;
    private final ExecutorService thread;
    private final int aheadRows;
    private final Function<BlockingQueue<Part>, Void> transaction;
    private BlockingQueue<Part> parts;
    private CompletableFuture<Void> written;

    StepWrite(JournalWriter writer, ExecutorService thread, int aheadRows, Function<BlockingQueue<Part>, Void> transaction) {
        this.writer = writer;
        this.thread = thread;
        this.aheadRows = aheadRows;
        this.transaction = transaction;
    }

    /** After each message of the step: hands its rows over once there are enough of them. */
    public void progress(JournalEntries step) {
        if (step.rowCount() < aheadRows) {
            return;
        }
        if (written == null) {
            BlockingQueue<Part> queue = new ArrayBlockingQueue<>(PARTS_WAITING);
            parts = queue;
            written = CompletableFuture.supplyAsync(() -> transaction.apply(queue), thread);
        }
        hand(new Rows(step.takeRows()));
    }

    /** Writes what the step holds still and commits it; returns once it is on disk. Throws as {@link JournalWriter#write} does. */
    public void finish(JournalEntries step) {
        if (written == null) {
            writer.write(step);
            return;
        }
        hand(new Rest(step));
        try {
            written.join();
        } catch (CompletionException e) {
            throw e.getCause() instanceof RuntimeException r ? r : e;
        }
    }

    /** The step failed on the caller's side: what was handed over is rolled back. Returns once it is. */
    public void abandon() {
        if (written == null) {
            return;
        }
        try {
            hand(new Abandon());
        } catch (RuntimeException ignored) {
            // the writer had failed already: nothing of the step was committed
        }
        written.exceptionally(e -> null).join();
    }

    /** Hands a part over, waiting while the writer thread has enough; throws the writer's failure instead of waiting for ever. */
    private void hand(Part part) {
        try {
            while (!parts.offer(part, 50, TimeUnit.MILLISECONDS)) {
                if (written.isDone()) {
                    written.join(); // throws the writer's failure
                    throw new IllegalStateException("the journal's writer stopped before the step was handed over");
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new JournalException("interrupted while handing a step to the journal's writer", e);
        } catch (CompletionException e) {
            throw e.getCause() instanceof RuntimeException r ? r : e;
        }
    }
}
