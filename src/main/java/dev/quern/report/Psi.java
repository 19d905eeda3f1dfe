package dev.quern.report;

/**
 * The Population Stability Index of a column between a reference run (E, the old one) and a new run
 * (A): {@code PSI = sum over bins of (A - E) * ln(A / E)}, with A and E the shares of each run's rows in
 * the bin. The bins always come from the reference run.
 *
 * <p>Empty bins: a bin with no rows in one run would make {@code ln(A / E)} infinite. Such a share is
 * replaced by {@link #EMPTY_BIN_SHARE} (0.0001, one row in ten thousand) before the sum, and the other
 * shares are left as they are; a bin empty in both runs adds nothing. So a level that appears from
 * nowhere in 10 % of the new rows adds {@code (0.1 - 0.0001) * ln(0.1 / 0.0001)}, about 0.69: a large
 * shift, as it should be. (A small floor instead of dropping the bin is common practice; the value of the
 * floor is our choice.)
 */
public final class Psi {

    /** The share given to a bin without rows in one run. */
    public static final double EMPTY_BIN_SHARE = 1e-4;

    private Psi() {
    }

    /**
     * How large a PSI is, by the reading used in credit scoring (Siddiqi 2017, Intelligent Credit Scoring,
     * 2nd ed.): below 0.10 no significant shift, 0.10 to 0.25 moderate, above 0.25 significant.
     */
    public enum Reading {
        STABLE("stable"),
        MODERATE("moderate shift"),
        LARGE("large shift");

        /** Below this: stable. */
        public static final double MODERATE_FROM = 0.10;
        /** Above this: large. */
        public static final double LARGE_ABOVE = 0.25;

        private final String label;

        Reading(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }

        public static Reading of(double psi) {
            if (psi < MODERATE_FROM) {
                return STABLE;
            }
            return psi <= LARGE_ABOVE ? MODERATE : LARGE;
        }
    }

    /** PSI from bin shares of the reference run ({@code expected}) and the new run ({@code actual}). */
    public static double of(double[] expected, double[] actual) {
        if (expected.length != actual.length) {
            throw new IllegalArgumentException("both runs need the same bins: " + expected.length + " and "
                    + actual.length);
        }
        double psi = 0;
        for (int i = 0; i < expected.length; i++) {
            if (expected[i] < 0 || actual[i] < 0) {
                throw new IllegalArgumentException("a share cannot be negative");
            }
            if (expected[i] == 0 && actual[i] == 0) {
                continue;
            }
            double e = expected[i] == 0 ? EMPTY_BIN_SHARE : expected[i];
            double a = actual[i] == 0 ? EMPTY_BIN_SHARE : actual[i];
            psi += (a - e) * Math.log(a / e);
        }
        return psi;
    }

    /** PSI from bin counts; NaN when either run has no rows at all. */
    public static double ofCounts(long[] expected, long[] actual) {
        return of(shares(expected), shares(actual));
    }

    private static double[] shares(long[] counts) {
        long total = 0;
        for (long c : counts) {
            total += c;
        }
        double[] out = new double[counts.length];
        if (total == 0) {
            java.util.Arrays.fill(out, Double.NaN);
            return out;
        }
        for (int i = 0; i < counts.length; i++) {
            out[i] = (double) counts[i] / total;
        }
        return out;
    }
}
