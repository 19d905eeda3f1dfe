package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** The bounded sketch behind charts and PSI bins: exact while small, a fixed-size sample after. */
class ValueSketchTest {

    @Test
    void countsFewLevelsExactlyAndTakesQuantilesFromThem() {
        ValueSketch s = ValueSketch.numbers();
        for (int i = 0; i < 1000; i++) {
            int v = i % 10 < 6 ? 0 : i % 10 < 9 ? 1 : 5;
            s.add(Integer.toString(v), v);
        }

        assertTrue(s.levelsExact());
        assertEquals(List.of(new ValueSketch.Level("0", 600), new ValueSketch.Level("1", 300),
                new ValueSketch.Level("5", 100)), s.levels());
        // The smallest value with at least a share p of the values at or below it.
        assertArrayEquals(new double[] {0, 0, 1, 1, 5}, s.quantiles(new double[] {0.1, 0.6, 0.61, 0.9, 0.91}));
    }

    @Test
    void decilesOfOneToAThousandAreTheHundreds() {
        ValueSketch s = ValueSketch.numbers();
        for (int v = 1000; v >= 1; v--) {
            s.add(Integer.toString(v), v);
        }

        assertFalse(s.levelsExact(), "more distinct values than levels");
        assertTrue(s.sampleComplete(), "but fewer than the sample holds");
        assertArrayEquals(new double[] {100, 200, 300, 400, 500, 600, 700, 800, 900},
                s.quantiles(new double[] {0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9}));
    }

    @Test
    void theSampleStaysAtItsSizeAndItsDecilesStayClose() {
        ValueSketch s = ValueSketch.numbers();
        int n = 200_000;
        for (int i = 0; i < n; i++) {
            // A permutation of 0..n-1, so the sample sees values in no helpful order.
            long v = (i * 7919L) % n;
            s.add(Long.toString(v), v);
        }

        assertEquals(ValueSketch.SAMPLE_SIZE, s.sample().length);
        assertEquals(n, s.count());
        double[] q = s.quantiles(new double[] {0.1, 0.5, 0.9});
        // A decile from 4,096 sampled values has a standard error near sqrt(0.09 / 4096) = 0.47 percentile;
        // three percentiles is more than six standard errors.
        assertEquals(0.1 * n, q[0], 0.03 * n);
        assertEquals(0.5 * n, q[1], 0.03 * n);
        assertEquals(0.9 * n, q[2], 0.03 * n);
    }

    @Test
    void theSameValuesInTheSameOrderGiveTheSameSample() {
        ValueSketch a = ValueSketch.numbers(4, 100);
        ValueSketch b = ValueSketch.numbers(4, 100);
        for (int i = 0; i < 10_000; i++) {
            double v = Math.sin(i) * 1000;
            a.add(Double.toString(v), v);
            b.add(Double.toString(v), v);
        }

        assertArrayEquals(a.sample(), b.sample());
    }

    @Test
    void everyValueIsEquallyLikelyToBeInTheSample() {
        // 4,000 sketches of 8 from the values 0..39, each with its own seed: each value should be kept by
        // about 4,000 x 8 / 40 = 800 of them.
        int values = 40;
        int capacity = 8;
        int sketches = 4_000;
        long[] kept = new long[values];
        for (int seed = 1; seed <= sketches; seed++) {
            ValueSketch s = ValueSketch.numbers(1, capacity, seed);
            for (int v = 0; v < values; v++) {
                s.add(Integer.toString(v), v);
            }
            for (double v : s.sample()) {
                kept[(int) v]++;
            }
        }
        double expected = (double) sketches * capacity / values;
        double chiSquare = 0;
        for (long k : kept) {
            chiSquare += (k - expected) * (k - expected) / expected;
        }
        // Pearson's statistic with 39 degrees of freedom exceeds 72.1 with probability 0.001 (the chi-square
        // table of NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.6.7.4). Each value is kept
        // by a sketch at most once, so the counts are less spread than multinomial ones: a fair sample stays
        // well below. A sampler that favoured the first or the last values would not.
        assertTrue(chiSquare < 72.1, "chi-square " + chiSquare + " of " + java.util.Arrays.toString(kept));
        assertEquals(sketches * capacity, java.util.Arrays.stream(kept).sum());
    }

    @Test
    void levelsBeyondTheLimitAreCountedTogether() {
        ValueSketch s = ValueSketch.text();
        for (int i = 0; i < ValueSketch.TEXT_LEVELS + 5; i++) {
            s.add("level " + i);
        }
        s.add("level 0");

        assertFalse(s.levelsExact());
        assertEquals(5, s.beyondLimit());
        assertEquals(ValueSketch.TEXT_LEVELS, s.levels().size());
        assertEquals(new ValueSketch.Level("level 0", 2), s.levels().get(0));
    }

    @Test
    void anEmptySketchHasNoQuantiles() {
        assertEquals(0, ValueSketch.numbers().quantiles(new double[] {0.5}).length);
        assertTrue(ValueSketch.numbers().quantile(0.5).isEmpty());
    }
}
