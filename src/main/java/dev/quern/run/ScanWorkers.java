package dev.quern.run;

import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;

/**
 * The scanned blocks' measures, each block on a thread of its own where each reads on a connection of its
 * own: a block's rows are read and its windows summed while the main query's next rows are read and the
 * last ones spilled. Every block takes the batches in order, one at a time, as its entities stream in key
 * order; the blocks are independent of each other, and each writes only its own cells of a row.
 *
 * <p>Where the blocks share the build's connection (SQLite, PostgreSQL, MariaDB), the driver lets one thread
 * at a time use it, and threads taking turns on it were slower than one thread alone: the measures are then
 * taken on the calling thread, batch by batch, in the same order.
 */
final class ScanWorkers implements AutoCloseable {

    /** The rows of the main query that go to the blocks together, each with its cutoff's place in the plan. */
    static final class Batch {
        final Object[][] rows;
        final int[] cutoffIndex;
        int size;
        private final List<Future<Void>> measured = new ArrayList<>();

        Batch(int capacity, int width) {
            rows = new Object[capacity][width];
            cutoffIndex = new int[capacity];
        }

        boolean full() {
            return size == rows.length;
        }
    }

    /** One block's measures of one row at its cutoff (the plan's {@code cutoff}th): into the block's cells. */
    interface Block {
        void measure(Object[] row, int cutoff) throws SQLException;
    }

    private final List<Block> blocks;
    private final List<ExecutorService> threads = new ArrayList<>();

    ScanWorkers(List<Block> blocks, boolean ownConnections) {
        this.blocks = List.copyOf(blocks);
        for (int b = 0; ownConnections && b < blocks.size(); b++) {
            String name = "quern-scan-" + (b + 1);
            threads.add(Executors.newSingleThreadExecutor(task -> {
                Thread thread = new Thread(task, name);
                thread.setDaemon(true);
                return thread;
            }));
        }
    }

    /**
     * Starts every block's measures of {@code batch}, which {@link #await} waits for; or, without threads,
     * takes them.
     */
    void start(Batch batch) throws SQLException {
        batch.measured.clear();
        for (int b = 0; b < blocks.size(); b++) {
            Block block = blocks.get(b);
            if (threads.isEmpty()) {
                measure(block, batch);
            } else {
                batch.measured.add(threads.get(b).submit(() -> {
                    measure(block, batch);
                    return null;
                }));
            }
        }
    }

    private static void measure(Block block, Batch batch) throws SQLException {
        for (int i = 0; i < batch.size; i++) {
            block.measure(batch.rows[i], batch.cutoffIndex[i]);
        }
    }

    /** Waits until every block has measured {@code batch}; a block's failure is thrown here as it was there. */
    void await(Batch batch) throws SQLException {
        for (Future<Void> f : batch.measured) {
            try {
                f.get();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted while measuring the scanned blocks", e);
            } catch (ExecutionException e) {
                if (e.getCause() instanceof SQLException s) {
                    throw s;
                }
                throw ThrownElsewhere.rethrow(e.getCause(), "measuring a scanned block");
            }
        }
        batch.measured.clear();
    }

    /**
     * Stops the threads once their current batch is done, so that no result is closed while a thread
     * still reads it.
     */
    @Override
    public void close() {
        for (ExecutorService thread : threads) {
            thread.shutdownNow();
        }
        for (ExecutorService thread : threads) {
            try {
                thread.awaitTermination(1, TimeUnit.MINUTES);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return;
            }
        }
    }
}
