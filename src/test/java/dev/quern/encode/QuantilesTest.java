package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.Random;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.junit.jupiter.api.Test;

/**
 * Quantiles (bin edges, medians) against Apache Commons Math 3.6.1 {@code Percentile} with estimation type
 * {@code R_7}: definition 7 of Hyndman and Fan (1996), the default of R and NumPy, which is the one Quern
 * states it uses. Commons Math is an independent implementation; the values are compared to 1e-12 relative.
 */
class QuantilesTest {

    private static final Percentile R7 = new Percentile().withEstimationType(Percentile.EstimationType.R_7);

    @Test
    void quantilesAgreeWithCommonsMathR7OnRandomData() {
        Random random = new Random(20250131);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + random.nextInt(trial < 20 ? 5 : 400);
            double[] values = new double[n];
            for (int i = 0; i < n; i++) {
                // Some trials with many ties (whole numbers from a small range), some continuous and skewed.
                values[i] = trial % 3 == 0 ? random.nextInt(4) : Math.exp(random.nextGaussian() * 2);
            }
            double[] sorted = values.clone();
            Arrays.sort(sorted);
            for (double p : new double[] {0.0, 0.1, 0.25, 1.0 / 3.0, 0.5, 2.0 / 3.0, 0.75, 0.9, 1.0}) {
                double expected = p == 0.0 ? sorted[0] : R7.evaluate(values, p * 100.0);
                assertEquals(expected, Quantiles.of(sorted, n, p), 1e-12 * Math.max(1.0, Math.abs(expected)),
                        "Q(" + p + ") of " + n + " values, trial " + trial);
            }
        }
    }

    @Test
    void binEdgesAreTheInnerQuantilesOfEqualShare() {
        double[] values = {7, 1, 3, 10, 5, 2, 8, 4, 9, 6};
        double[] edges = Quantiles.edges(values.clone(), values.length, 4);
        double[] expected = {R7.evaluate(values, 25.0), R7.evaluate(values, 50.0), R7.evaluate(values, 75.0)};
        assertArrayEquals(expected, edges, 1e-12);
        // By hand, h = (n - 1) p: Q(0.25) = x[2.25] = 3.25, Q(0.5) = x[4.5] = 5.5, Q(0.75) = x[6.75] = 7.75.
        assertArrayEquals(new double[] {3.25, 5.5, 7.75}, edges, 1e-12);
    }

    @Test
    void repeatedEdgesAreMergedSoManyEqualValuesMakeFewerBins() {
        double[] values = {0, 0, 0, 0, 0, 0, 0, 1, 2, 3};
        double[] edges = Quantiles.edges(values.clone(), values.length, 4);
        // Q(0.25) = Q(0.5) = 0 and Q(0.75) = x[6.75] = 0.75: two edges, three bins.
        assertArrayEquals(new double[] {0.0, 0.75}, edges, 1e-12);
    }

    @Test
    void aValueOnAnEdgeBelongsToTheBinBelowIt() {
        double[] edges = {3.25, 5.5, 7.75};
        assertEquals(1, Quantiles.bin(edges, -100));
        assertEquals(1, Quantiles.bin(edges, 3.25));
        assertEquals(2, Quantiles.bin(edges, 3.2500001));
        assertEquals(3, Quantiles.bin(edges, 7.75));
        assertEquals(4, Quantiles.bin(edges, 7.76));
        assertEquals(1, Quantiles.bin(new double[0], 42), "no edges: one bin");
    }

    @Test
    void theMedianIsTheMiddleValueOrTheMeanOfTheTwoMiddleValues() {
        assertEquals(3.0, Quantiles.of(new double[] {1, 3, 9}, 3, 0.5), 0.0);
        assertEquals(5.0, Quantiles.of(new double[] {1, 3, 7, 9}, 4, 0.5), 0.0);
        assertEquals(R7.evaluate(new double[] {9, 1, 7, 3}, 50.0), 5.0, 0.0);
    }
}
