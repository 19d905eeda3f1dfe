package dev.quern.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import java.util.SplittableRandom;
import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;
import org.apache.commons.math3.stat.inference.MannWhitneyUTest;
import org.apache.commons.math3.stat.ranking.NaNStrategy;
import org.apache.commons.math3.stat.ranking.NaturalRanking;
import org.apache.commons.math3.stat.ranking.TiesStrategy;
import org.junit.jupiter.api.Test;

/** The screen's rank statistics against a published worked example and an independent library. */
class RankStatisticsTest {

    /**
     * Mann-Whitney U test, finishing-order example, Wikipedia: six tortoises (T) and six hares (H) finish in
     * the order T H H H H H T T T T T H. U_T counts the (T, H) pairs in which the tortoise finished first: 11;
     * U_H = 25; together 36 = 6 x 6. As an AUC (Hanley and McNeil 1982): U / (n1 n2).
     */
    @Test
    void finishingOrderExampleGivesUOfElevenAndTwentyFive() {
        String order = "THHHHHTTTTTH";
        double[] tortoises = new double[6];
        double[] hares = new double[6];
        int t = 0;
        int h = 0;
        for (int place = 1; place <= order.length(); place++) {
            double earlierIsHigher = -place;
            if (order.charAt(place - 1) == 'T') {
                tortoises[t++] = earlierIsHigher;
            } else {
                hares[h++] = earlierIsHigher;
            }
        }
        assertEquals(11.0, RankStatistics.mannWhitneyU(tortoises, hares));
        assertEquals(25.0, RankStatistics.mannWhitneyU(hares, tortoises));
        assertEquals(11.0 / 36, RankStatistics.auc(tortoises, hares), 1e-15);
        assertEquals(25.0 / 36, RankStatistics.auc(hares, tortoises), 1e-15);
    }

    /** Ties count one half: two equal scores of opposite labels give an AUC of exactly 0.5. */
    @Test
    void tiesCountOneHalf() {
        assertEquals(0.5, RankStatistics.auc(new double[] {3}, new double[] {3}));
        // Pairs (3,3) half, (3,1), (4,3), (4,1) whole: 3.5 of 4.
        assertEquals(0.875, RankStatistics.auc(new double[] {3, 4}, new double[] {3, 1}));
        assertEquals(1.0, RankStatistics.auc(new double[] {5, 6}, new double[] {1, 2}));
        assertEquals(0.0, RankStatistics.auc(new double[] {1, 2}, new double[] {5, 6}));
    }

    /**
     * Apache Commons Math's MannWhitneyUTest (commons-math3) as an independent reference: its
     * {@code mannWhitneyU} returns max(U1, U2); U1 itself is the rank sum of the first sample from its
     * NaturalRanking with average ties, minus n1 (n1 + 1) / 2. Many ties, unequal sample sizes.
     */
    @Test
    void agreesWithCommonsMathOnSamplesWithTies() {
        SplittableRandom random = new SplittableRandom(20250131L);
        for (int round = 0; round < 20; round++) {
            double[] x = new double[5 + random.nextInt(60)];
            double[] y = new double[5 + random.nextInt(60)];
            Arrays.setAll(x, i -> random.nextInt(12));
            Arrays.setAll(y, i -> random.nextInt(10) - 1);
            double u = RankStatistics.mannWhitneyU(x, y);
            double pairs = (double) x.length * y.length;
            assertEquals(new MannWhitneyUTest().mannWhitneyU(x, y), Math.max(u, pairs - u), 1e-9, "round " + round);
            double[] both = new double[x.length + y.length];
            System.arraycopy(x, 0, both, 0, x.length);
            System.arraycopy(y, 0, both, x.length, y.length);
            double[] ranks = new NaturalRanking(NaNStrategy.FIXED, TiesStrategy.AVERAGE).rank(both);
            double rankSum = 0;
            for (int i = 0; i < x.length; i++) {
                rankSum += ranks[i];
            }
            assertEquals(rankSum - x.length * (x.length + 1) / 2.0, u, 1e-9, "U1 of round " + round);
        }
    }

    /** Apache Commons Math's SpearmansCorrelation (average ranks for ties) as an independent reference. */
    @Test
    void spearmanAgreesWithCommonsMath() {
        SplittableRandom random = new SplittableRandom(7L);
        for (int round = 0; round < 20; round++) {
            int n = 3 + random.nextInt(200);
            double[] x = new double[n];
            double[] y = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = random.nextInt(15);
                y[i] = x[i] * (round % 3 - 1) + random.nextInt(8);
            }
            assertEquals(new SpearmansCorrelation().correlation(x, y), RankStatistics.spearman(x, y), 1e-12,
                    "round " + round);
        }
        assertEquals(1.0, RankStatistics.spearman(new double[] {1, 2, 3}, new double[] {10, 20, 300}), 1e-15);
        assertTrue(Double.isNaN(RankStatistics.spearman(new double[] {1, 1, 1}, new double[] {1, 2, 3})),
                "a constant column has no rank correlation");
    }

    /** An empty value ranks below every number, so a column that is empty exactly for one label is caught. */
    @Test
    void emptyValuesRankLowest() {
        double empty = MatrixScan.number("", dev.quern.schema.ValueType.DECIMAL);
        assertEquals(Double.NEGATIVE_INFINITY, empty);
        assertEquals(1.0, RankStatistics.auc(new double[] {0, -5}, new double[] {empty, empty}));
        assertEquals(0.5, RankStatistics.auc(new double[] {empty}, new double[] {empty}));
    }

    /** A text column is scored by its levels' share of positives: levels that split the label give AUC 1. */
    @Test
    void textLevelsAreScoredByTheirShareOfPositives() {
        Map<String, long[]> split = new HashMap<>();
        split.put("cancelled", new long[] {0, 40});
        split.put("active", new long[] {300, 0});
        split.put("paused", new long[] {20, 0});
        assertEquals(1.0, MatrixScan.levelAuc(split));
        Map<String, long[]> even = new HashMap<>();
        even.put("centre", new long[] {50, 5});
        even.put("river", new long[] {100, 10});
        assertEquals(0.5, MatrixScan.levelAuc(even), 1e-12);
        // 2 levels: share 0.2 (neg 40, pos 10) and 0.5 (neg 10, pos 10): U = 10*(0 + 20) + 10*(40 + 5) = 650.
        Map<String, long[]> mixed = new HashMap<>();
        mixed.put("a", new long[] {40, 10});
        mixed.put("b", new long[] {10, 10});
        assertEquals(650.0 / (20 * 50), MatrixScan.levelAuc(mixed), 1e-12);
    }
}
