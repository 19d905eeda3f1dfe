package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.run.ValueSketch;
import java.util.List;
import org.junit.jupiter.api.Test;

/** PSI bins chosen from the old run: deciles for numbers, frequent levels for text, empty on its own. */
class BinsTest {

    @Test
    void numbersAreBinnedAtTheDecilesOfTheOldValues() {
        ValueSketch old = ValueSketch.numbers();
        for (int v = 1; v <= 1000; v++) {
            old.add(Integer.toString(v), v);
        }
        Bins.Numeric bins = Bins.Numeric.of(old);

        assertArrayEquals(new double[] {100, 200, 300, 400, 500, 600, 700, 800, 900}, bins.edges());
        assertEquals(11, bins.size());
        assertEquals(0, bins.bin(""), "empty");
        assertEquals(1, bins.bin("-5"));
        assertEquals(1, bins.bin("100"), "an edge belongs to the bin it closes");
        assertEquals(2, bins.bin("100.5"));
        assertEquals(9, bins.bin("900"));
        assertEquals(10, bins.bin("900.01"));
        assertEquals(10, bins.bin("1e9"));
        assertEquals(0, bins.bin("n/a"), "text in a number column counts as empty");
        assertEquals(List.of("(empty)", "<= 100", "(100, 200]", "(200, 300]", "(300, 400]", "(400, 500]",
                "(500, 600]", "(600, 700]", "(700, 800]", "(800, 900]", "> 900"), bins.labels());
    }

    @Test
    void tiedDecilesCollapseIntoFewerBins() {
        // A count that is mostly 0: seven deciles are 0, so 0 gets one bin and the rest split the tail.
        ValueSketch old = ValueSketch.numbers();
        for (int i = 0; i < 100; i++) {
            int v = i < 70 ? 0 : i < 85 ? 1 : i < 95 ? 2 : 7;
            old.add(Integer.toString(v), v);
        }
        Bins.Numeric bins = Bins.Numeric.of(old);

        assertArrayEquals(new double[] {0, 1, 2}, bins.edges());
        assertEquals(List.of("(empty)", "<= 0", "(0, 1]", "(1, 2]", "> 2"), bins.labels());
    }

    @Test
    void aColumnWithoutOldValuesHasOneBinForAnyValue() {
        Bins.Numeric bins = Bins.Numeric.of(ValueSketch.numbers());

        assertEquals(List.of("(empty)", "any value"), bins.labels());
        assertEquals(1, bins.bin("42"));
    }

    @Test
    void rareAndNewLevelsShareOneBin() {
        ValueSketch old = ValueSketch.text();
        for (int i = 0; i < 1000; i++) {
            old.add(i < 600 ? "commuter" : i < 995 ? "unlimited" : "trial");
        }
        Bins.Levels bins = Bins.Levels.of(old);

        assertEquals(List.of("(empty)", "commuter", "unlimited", "(rare or new levels)"), bins.labels());
        assertEquals(1, bins.bin("commuter"));
        assertEquals(3, bins.bin("trial"), "below 1% of the old values");
        assertEquals(3, bins.bin("family"), "never seen before");
        assertEquals(0, bins.bin(""));
        assertEquals(3, bins.binner().applyAsInt("family"));
        assertEquals(2, bins.binner().applyAsInt("unlimited"));
    }

    @Test
    void atMostTwentyLevelsGetABinOfTheirOwn() {
        ValueSketch old = ValueSketch.text();
        for (int level = 0; level < 30; level++) {
            for (int i = 0; i <= level; i++) {
                old.add(String.format("l%02d", level));
            }
        }
        Bins.Levels bins = Bins.Levels.of(old);

        assertEquals(Bins.MAX_LEVELS, bins.levels().size());
        assertEquals("l29", bins.levels().get(0), "most frequent first");
    }
}
