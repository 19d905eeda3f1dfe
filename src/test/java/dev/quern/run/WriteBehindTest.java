package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/** Rows formatted on the reading thread and written on another: all of them, in order, and failures told. */
class WriteBehindTest {

    @Test
    void writesEveryRowInOrderWithItsTextsOnAnotherThread() {
        List<String> seen = new ArrayList<>();
        List<Thread> writers = new ArrayList<>();
        Object[] row = new Object[2];
        // Not a multiple of any batch size, so the last batch is a partial one.
        int count = 10_007;
        try (WriteBehind behind = new WriteBehind(2, WriteBehindTest::texts, (values, texts) -> {
            seen.add(values[0] + "=" + texts[0] + "|" + values[1] + "=" + texts[1]);
            if (writers.isEmpty()) {
                writers.add(Thread.currentThread());
            }
        })) {
            for (long i = 0; i < count; i++) {
                // The same array every time: the rows queued must not change with it.
                row[0] = i;
                row[1] = i % 3 == 0 ? null : "r" + i;
                behind.accept(row);
            }
            behind.finish();
        }
        assertEquals(count, seen.size());
        for (int i = 0; i < count; i++) {
            String second = i % 3 == 0 ? "null=" : "r" + i + "=R" + i;
            assertEquals(i + "=#" + i + "|" + second, seen.get(i));
        }
        assertNotSame(Thread.currentThread(), writers.get(0));
    }

    @Test
    void aFailureOfTheWriterIsThrownOnTheReadingSide() {
        UncheckedIOException disk = new UncheckedIOException(new java.io.IOException("no space left on device"));
        Object[] row = {1L};
        try (WriteBehind behind = new WriteBehind(1, WriteBehindTest::texts, (values, texts) -> {
            throw disk;
        })) {
            // The reader learns of it at the latest when it has no free batch left, or at finish.
            UncheckedIOException thrown = assertThrows(UncheckedIOException.class, () -> {
                for (int i = 0; i < 1_000_000; i++) {
                    behind.accept(row);
                }
                behind.finish();
            });
            assertSame(disk, thrown);
        }
    }

    @Test
    void aFailureInTheLastBatchIsThrownByFinish() {
        IllegalStateException bad = new IllegalStateException("bad row");
        try (WriteBehind behind = new WriteBehind(1, WriteBehindTest::texts, (values, texts) -> {
            throw bad;
        })) {
            behind.accept(new Object[] {1L});
            assertSame(bad, assertThrows(IllegalStateException.class, behind::finish));
        }
    }

    @Test
    void closingWithoutFinishingStopsTheWriter() throws InterruptedException {
        CountDownLatch writing = new CountDownLatch(1);
        List<Thread> writer = new ArrayList<>();
        WriteBehind behind = new WriteBehind(1, WriteBehindTest::texts, (values, texts) -> {
            writer.add(Thread.currentThread());
            writing.countDown();
        });
        for (int i = 0; i < 300; i++) {
            behind.accept(new Object[] {(long) i});
        }
        assertTrue(writing.await(10, TimeUnit.SECONDS));
        behind.close();
        writer.get(0).join(10_000);
        assertTrue(!writer.get(0).isAlive(), "the writing thread ended");
    }

    private static void texts(Object[] values, String[] texts) {
        for (int i = 0; i < values.length; i++) {
            Object v = values[i];
            texts[i] = v == null ? "" : v instanceof Long ? "#" + v : ((String) v).toUpperCase();
        }
    }
}
