package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.junit.jupiter.api.Test;

/** Rows through the spill files: back in cutoff order, each value with the type the matrix writer expects. */
class CutoffSpillTest {

    @Test
    void keepsEveryValueWithItsTypeAndNormalisesSmallNumbersAsBefore() throws IOException {
        UUID id = UUID.fromString("123e4567-e89b-12d3-a456-426614174000");
        Object[] row = {null, 42L, 7, (short) -3, (byte) 1, 1.5, 2.25f, Double.NaN, -0.0, Double.NEGATIVE_INFINITY,
            Long.MIN_VALUE, LocalDate.of(2025, 1, 31), LocalDateTime.of(2024, 3, 31, 2, 30, 15),
            new BigDecimal("-12.3400"), true, false, "text, with \"quotes\"", "", "日本 é", id};
        Object[] expected = {null, 42L, 7L, -3L, 1L, 1.5, 2.25, Double.NaN, -0.0, Double.NEGATIVE_INFINITY,
            Long.MIN_VALUE, LocalDate.of(2025, 1, 31), LocalDateTime.of(2024, 3, 31, 2, 30, 15),
            new BigDecimal("-12.3400"), true, false, "text, with \"quotes\"", "", "日本 é", id.toString()};

        List<Object[]> back = roundTrip(1, List.<int[]>of(new int[] {0}), List.<Object[]>of(row));

        assertEquals(1, back.size());
        for (int i = 0; i < expected.length; i++) {
            Object v = back.get(0)[i];
            assertEquals(expected[i] == null ? null : expected[i].getClass(), v == null ? null : v.getClass(),
                    "type of value " + i);
            assertEquals(expected[i], v, "value " + i);
        }
        assertEquals(Double.doubleToRawLongBits(-0.0), Double.doubleToRawLongBits((Double) back.get(0)[8]));
    }

    @Test
    void replaysCutoffByCutoffInArrivalOrderAcrossManyBuffers() throws IOException {
        // Rows arrive key by key, each key at three cutoffs; repeated and changing texts, and one text longer
        // than the spill's buffer, so chunk edges fall inside values of every kind.
        String longText = "x".repeat(200_000) + "é";
        List<Object[]> rows = new ArrayList<>();
        List<int[]> cutoffs = new ArrayList<>();
        for (long key = 0; key < 30_000; key++) {
            for (int c = 2; c >= 0; c--) {
                String text = key == 12_345 ? longText : key % 7 == 0 ? "seventh" : "other";
                rows.add(new Object[] {key, "2025-0" + (c + 1) + "-28", text, key * 0.5, c == 1 ? null : key});
                cutoffs.add(new int[] {c});
            }
        }

        List<Object[]> back = roundTrip(3, cutoffs, rows);

        List<Object[]> expected = new ArrayList<>();
        for (int c = 0; c < 3; c++) {
            for (int i = 0; i < rows.size(); i++) {
                if (cutoffs.get(i)[0] == c) {
                    expected.add(rows.get(i));
                }
            }
        }
        assertEquals(expected.size(), back.size());
        for (int i = 0; i < expected.size(); i++) {
            assertArrayEquals(expected.get(i), back.get(i), "row " + i);
        }
    }

    @Test
    void daysOfCutoffsShareTheWriteBuffersAndStillKeepEveryValue() throws IOException {
        // Five thousand cutoffs get the smallest write buffer each, smaller than some texts here.
        int cutoffCount = 5_000;
        List<Object[]> rows = new ArrayList<>();
        List<int[]> cutoffs = new ArrayList<>();
        for (long key = 0; key < 4; key++) {
            for (int c = 0; c < cutoffCount; c++) {
                String text = c % 1_000 == 7 ? "y".repeat(10_000 + c) : "day " + c;
                rows.add(new Object[] {key, text, c * 0.25});
                cutoffs.add(new int[] {c});
            }
        }

        List<Object[]> back = roundTrip(cutoffCount, cutoffs, rows);

        assertEquals(rows.size(), back.size());
        int i = 0;
        for (int c = 0; c < cutoffCount; c++) {
            for (long key = 0; key < 4; key++) {
                assertArrayEquals(rows.get((int) (key * cutoffCount + c)), back.get(i++), "cutoff " + c + ", key " + key);
            }
        }
    }

    private static List<Object[]> roundTrip(int cutoffCount, List<int[]> cutoffs, List<Object[]> rows)
            throws IOException {
        List<Object[]> back = new ArrayList<>();
        try (CutoffSpill spill = new CutoffSpill(cutoffCount, rows.get(0).length)) {
            for (int i = 0; i < rows.size(); i++) {
                spill.add(cutoffs.get(i)[0], rows.get(i));
            }
            // The spill reuses its row array, so the sink copies what it keeps.
            spill.replay(r -> back.add(r.clone()));
        }
        return back;
    }
}
