package dev.quern.audit;

import java.util.Arrays;

/**
 * Rank statistics of the single-feature screen, computed exactly from sorted copies of the values.
 *
 * <p>The AUC of a score against a binary label is the Mann-Whitney U of the positives divided by
 * {@code n1 * n0}: the share of (positive, negative) pairs in which the positive scores higher, a tie counting
 * one half (Hanley and McNeil 1982, Radiology 143:29-36). Spearman's rho is Pearson's correlation of the
 * ranks, tied values sharing their average rank. An empty value is given as
 * {@link Double#NEGATIVE_INFINITY}: it ranks below every number and ties with the other empty values, so a
 * column whose emptiness alone gives the label away is screened as well.
 */
final class RankStatistics {

    private RankStatistics() {
    }

    /**
     * U of the positives: the number of (positive, negative) pairs where the positive is larger, plus one half
     * for each tie. O(n log n) time; sorts copies, so it needs {@code 8 * (n1 + n0)} bytes beside its input.
     */
    static double mannWhitneyU(double[] positives, double[] negatives) {
        double[] pos = positives.clone();
        double[] neg = negatives.clone();
        Arrays.sort(pos);
        Arrays.sort(neg);
        double u = 0;
        int below = 0;
        int atOrBelow = 0;
        for (double x : pos) {
            while (below < neg.length && neg[below] < x) {
                below++;
            }
            if (atOrBelow < below) {
                atOrBelow = below;
            }
            while (atOrBelow < neg.length && neg[atOrBelow] <= x) {
                atOrBelow++;
            }
            u += below + 0.5 * (atOrBelow - below);
        }
        return u;
    }

    /** The AUC of a score: U / (n1 n0); NaN when either class is empty. */
    static double auc(double[] positives, double[] negatives) {
        if (positives.length == 0 || negatives.length == 0) {
            return Double.NaN;
        }
        return mannWhitneyU(positives, negatives) / ((double) positives.length * negatives.length);
    }

    /** Spearman's rho with average ranks for ties; NaN when fewer than two values or either side is constant. */
    static double spearman(double[] x, double[] y) {
        if (x.length != y.length) {
            throw new IllegalArgumentException("x and y differ in length: " + x.length + " and " + y.length);
        }
        int n = x.length;
        if (n < 2) {
            return Double.NaN;
        }
        double[] sx = x.clone();
        double[] sy = y.clone();
        Arrays.sort(sx);
        Arrays.sort(sy);
        // Pearson's correlation of the ranks, accumulated stably (Welford's co-moment update).
        double meanX = 0;
        double meanY = 0;
        double sxx = 0;
        double syy = 0;
        double sxy = 0;
        for (int i = 0; i < n; i++) {
            double rx = rank(sx, x[i]);
            double ry = rank(sy, y[i]);
            double dx = rx - meanX;
            double dy = ry - meanY;
            int k = i + 1;
            meanX += dx / k;
            meanY += dy / k;
            sxx += dx * (rx - meanX);
            syy += dy * (ry - meanY);
            sxy += dx * (ry - meanY);
        }
        if (sxx == 0 || syy == 0) {
            return Double.NaN;
        }
        return sxy / Math.sqrt(sxx * syy);
    }

    /** The 1-based average rank of {@code v} among {@code sorted}, which holds it. */
    static double rank(double[] sorted, double v) {
        int first = lowerBound(sorted, v);
        int last = upperBound(sorted, v);
        return (first + 1 + last) / 2.0;
    }

    /** The first index whose value is not below {@code v}. */
    private static int lowerBound(double[] a, double v) {
        int lo = 0;
        int hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] < v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** The first index whose value is above {@code v}. */
    private static int upperBound(double[] a, double v) {
        int lo = 0;
        int hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] <= v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
