package dev.quern.run;

import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.function.Consumer;

/**
 * Writing the matrix on two threads. The thread that reads the rows (from the engine or a spill) also turns
 * every cell into its text; a second thread takes the rows, a batch at a time and in the order they came,
 * and counts and writes them. Reading and formatting cost about what counting and writing do, so on a
 * machine with a core to spare the write takes little more than half as long.
 *
 * <p>The rows travel in a few batches that go back and forth between the two threads, so memory stays
 * fixed whatever the row count. A failure on the writing side is thrown on the reading side at its next
 * row or at {@link #finish}, as it was thrown there.
 *
 * <pre>{@code
 * try (WriteBehind behind = new WriteBehind(width, rows::format, rows::count)) {
 *     for each row: behind.accept(values);
 *     behind.finish();
 * }
 * }</pre>
 */
final class WriteBehind implements Consumer<Object[]>, AutoCloseable {

    /** Turns a row's values into the texts of its cells, on the reading thread. */
    interface Cells {
        void format(Object[] values, String[] texts);
    }

    /** Takes a row's values and texts, on the writing thread; neither array may be kept. */
    interface Sink {
        void accept(Object[] values, String[] texts);
    }

    /** Rows per batch: enough that the threads meet rarely, few enough that a batch stays in the cache. */
    private static final int ROWS = 256;
    private static final int BATCHES = 4;

    private static final class Batch {
        final Object[][] values;
        final String[][] texts;
        int size;

        Batch(int rows, int width) {
            values = new Object[rows][width];
            texts = new String[rows][width];
        }
    }

    /** Sent after the last batch: the writing thread stops. */
    private static final Batch END = new Batch(0, 0);
    /** Sent back by a writing thread that failed, to wake the reading thread. */
    private static final Batch FAILED = new Batch(0, 0);

    private final int width;
    private final Cells cells;
    private final Sink sink;
    // One more place than there are batches, for END or FAILED: a put never waits.
    private final BlockingQueue<Batch> full = new ArrayBlockingQueue<>(BATCHES + 1);
    private final BlockingQueue<Batch> free = new ArrayBlockingQueue<>(BATCHES + 1);
    private final Thread writer;
    private volatile Throwable failure;
    private Batch filling;
    private boolean finished;

    WriteBehind(int width, Cells cells, Sink sink) {
        this.width = width;
        this.cells = cells;
        this.sink = sink;
        for (int i = 1; i < BATCHES; i++) {
            free.add(new Batch(ROWS, width));
        }
        this.filling = new Batch(ROWS, width);
        this.writer = new Thread(this::write, "quern-write-behind");
        // A build that fails on the reading side ends without waiting for rows nobody will read.
        writer.setDaemon(true);
        writer.start();
    }

    /** Formats the row and queues it; {@code values} is copied and may be refilled for the next row. */
    @Override
    public void accept(Object[] values) {
        Batch batch = filling;
        int at = batch.size;
        System.arraycopy(values, 0, batch.values[at], 0, width);
        cells.format(batch.values[at], batch.texts[at]);
        if (++batch.size == ROWS) {
            full.add(batch);
            filling = take();
        }
    }

    /** Waits until every row queued is written; throws the writing thread's failure, if any. */
    void finish() {
        if (filling.size > 0) {
            full.add(filling);
        }
        full.add(END);
        finished = true;
        join();
        rethrow();
    }

    /** Stops the writing thread if {@link #finish} did not end it: the rows queued are then dropped. */
    @Override
    public void close() {
        if (!finished) {
            finished = true;
            writer.interrupt();
            join();
        }
    }

    private void write() {
        try {
            while (true) {
                Batch batch = full.take();
                if (batch == END) {
                    return;
                }
                for (int i = 0; i < batch.size; i++) {
                    sink.accept(batch.values[i], batch.texts[i]);
                }
                batch.size = 0;
                free.add(batch);
            }
        } catch (InterruptedException e) {
            // Closed before the end: the reading side has failed and reports its own failure.
        } catch (Throwable t) {
            failure = t;
            free.add(FAILED);
        }
    }

    private Batch take() {
        Batch batch;
        try {
            batch = free.take();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while writing the matrix", e);
        }
        if (batch == FAILED) {
            rethrow();
        }
        return batch;
    }

    private void join() {
        try {
            writer.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while writing the matrix", e);
        }
    }

    private void rethrow() {
        if (failure != null) {
            throw ThrownElsewhere.rethrow(failure, "writing the matrix");
        }
    }
}
