package dev.quern.encode;

/**
 * Mean and sample variance in one pass and constant memory, updated as Welford (1962) did: each value moves
 * the mean by its share of the difference, and the sum of squared differences from the running mean grows by
 * (x - old mean)(x - new mean). Unlike the sum of squares minus the square of the sum, this stays accurate
 * when the values are large and close together (NIST StRD NumAcc3 and NumAcc4).
 */
final class RunningMoments {

    private long n;
    private double mean;
    private double squares;

    void add(double x) {
        n++;
        double before = mean;
        mean += (x - before) / n;
        squares += (x - before) * (x - mean);
    }

    long count() {
        return n;
    }

    /** The mean; NaN without values. */
    double mean() {
        return n == 0 ? Double.NaN : mean;
    }

    /** The sample standard deviation (n - 1); NaN with fewer than two values. */
    double sampleSd() {
        return n < 2 ? Double.NaN : Math.sqrt(squares / (n - 1));
    }
}
