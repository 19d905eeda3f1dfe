package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.sql.SQLException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import org.junit.jupiter.api.Test;

/** The blocks' measures of a batch: each block sees every row in order, writes its own cells, and fails loudly. */
class ScanWorkersTest {

    @Test
    void eachBlockMeasuresEveryRowInOrderOnAThreadOfItsOwn() throws SQLException {
        List<List<Object>> seen = List.of(Collections.synchronizedList(new ArrayList<>()),
                Collections.synchronizedList(new ArrayList<>()));
        Set<Thread> threads = ConcurrentHashMap.newKeySet();
        List<ScanWorkers.Block> blocks = new ArrayList<>();
        for (int b = 0; b < 2; b++) {
            int block = b;
            blocks.add((row, cutoff) -> {
                seen.get(block).add(row[0]);
                threads.add(Thread.currentThread());
                row[1 + block] = "block " + block + " of " + row[0] + " at cutoff " + cutoff;
            });
        }
        try (ScanWorkers workers = new ScanWorkers(blocks, true)) {
            ScanWorkers.Batch first = batch(0, 5);
            ScanWorkers.Batch second = batch(5, 3);
            workers.start(first);
            workers.start(second);
            workers.await(first);
            workers.await(second);
            for (ScanWorkers.Batch batch : List.of(first, second)) {
                for (int i = 0; i < batch.size; i++) {
                    String at = " at cutoff " + batch.cutoffIndex[i];
                    assertEquals("block 0 of " + batch.rows[i][0] + at, batch.rows[i][1]);
                    assertEquals("block 1 of " + batch.rows[i][0] + at, batch.rows[i][2]);
                }
            }
        }
        assertEquals(List.of(0L, 1L, 2L, 3L, 4L, 5L, 6L, 7L), seen.get(0));
        assertEquals(seen.get(0), seen.get(1));
        assertEquals(2, threads.size());
        assertFalse(threads.contains(Thread.currentThread()));
    }

    @Test
    void withoutThreadsTheCallerMeasuresAtStart() throws SQLException {
        List<Thread> threads = new ArrayList<>();
        try (ScanWorkers workers = new ScanWorkers(List.of((row, cutoff) -> {
            threads.add(Thread.currentThread());
            row[1] = row[0];
        }), false)) {
            ScanWorkers.Batch batch = batch(0, 2);
            workers.start(batch);
            assertEquals(1L, batch.rows[1][1]);
            workers.await(batch);
        }
        assertEquals(List.of(Thread.currentThread(), Thread.currentThread()), threads);
    }

    @Test
    void aBlocksFailureIsThrownByAwaitAsItWasThrown() throws SQLException {
        SQLException lost = new SQLException("connection lost");
        IllegalStateException bad = new IllegalStateException("out of order");
        try (ScanWorkers workers = new ScanWorkers(List.of((row, cutoff) -> {
            throw lost;
        }), true)) {
            ScanWorkers.Batch batch = batch(0, 1);
            workers.start(batch);
            assertSame(lost, assertThrows(SQLException.class, () -> workers.await(batch)));
        }
        try (ScanWorkers workers = new ScanWorkers(List.of((row, cutoff) -> {
            throw bad;
        }), true)) {
            ScanWorkers.Batch batch = batch(0, 1);
            workers.start(batch);
            assertSame(bad, assertThrows(IllegalStateException.class, () -> workers.await(batch)));
        }
    }

    private static ScanWorkers.Batch batch(long firstKey, int size) {
        ScanWorkers.Batch batch = new ScanWorkers.Batch(10, 3);
        for (int i = 0; i < size; i++) {
            batch.rows[i][0] = firstKey + i;
            batch.cutoffIndex[i] = i % 3;
        }
        batch.size = size;
        return batch;
    }
}
