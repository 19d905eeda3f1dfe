package dev.quern.encode;

import java.util.Arrays;

/**
 * Sample quantiles by definition 7 of Hyndman and Fan (1996, "Sample quantiles in statistical packages",
 * The American Statistician 50:361-365), the default of R and of NumPy: for p in [0, 1] and sorted values
 * x[0..n-1], h = (n - 1) p and Q(p) = x[floor h] + (h - floor h) (x[floor h + 1] - x[floor h]). Apache
 * Commons Math names it {@code Percentile.EstimationType.R_7}. Q(0.5) is the usual median.
 */
final class Quantiles {

    private Quantiles() {
    }

    /** Q(p) of the first {@code n} values of {@code sorted}, which must be in ascending order. */
    static double of(double[] sorted, int n, double p) {
        if (n == 0) {
            throw new IllegalArgumentException("no values");
        }
        if (p < 0.0 || p > 1.0) {
            throw new IllegalArgumentException("p must be in [0, 1]: " + p);
        }
        double h = (n - 1) * p;
        int lo = (int) Math.floor(h);
        if (lo >= n - 1) {
            return sorted[n - 1];
        }
        double fraction = h - lo;
        return fraction == 0.0 ? sorted[lo] : sorted[lo] + fraction * (sorted[lo + 1] - sorted[lo]);
    }

    /**
     * The inner edges of {@code count} bins of equal training share: Q(1/count) ... Q((count-1)/count), with
     * repeated edges dropped (many equal values make fewer bins). Sorts the first {@code n} values in place.
     */
    static double[] edges(double[] values, int n, int count) {
        Arrays.sort(values, 0, n);
        double[] edges = new double[count - 1];
        int kept = 0;
        for (int j = 1; j < count; j++) {
            double q = of(values, n, (double) j / count);
            if (kept == 0 || q > edges[kept - 1]) {
                edges[kept++] = q;
            }
        }
        return Arrays.copyOf(edges, kept);
    }

    /** The bin of {@code x}: 1 + the number of edges below it, so bins are (-inf, e1], (e1, e2], ..., (ek, inf). */
    static int bin(double[] edges, double x) {
        int lo = 0;
        int hi = edges.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (edges[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo + 1;
    }
}
