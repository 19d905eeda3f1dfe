package dev.quern.sample;

import java.util.SplittableRandom;

/**
 * Random draws from the few distributions the simulation needs. Written out here, on
 * {@link StrictMath}, rather than taken from the JDK's defaults so that the same seed gives the same
 * numbers on every JVM and processor.
 */
final class Draws {

    private Draws() {
    }

    static double uniform(SplittableRandom random, double low, double high) {
        return low + (high - low) * random.nextDouble();
    }

    static long uniform(SplittableRandom random, long low, long highExclusive) {
        return low + random.nextLong(highExclusive - low);
    }

    static boolean chance(SplittableRandom random, double probability) {
        return random.nextDouble() < probability;
    }

    /** Box-Muller; one of the pair is thrown away to keep the draw stateless. */
    static double gaussian(SplittableRandom random) {
        double u = 1.0 - random.nextDouble();
        double v = random.nextDouble();
        return StrictMath.sqrt(-2.0 * StrictMath.log(u)) * StrictMath.cos(2.0 * StrictMath.PI * v);
    }

    static double normal(SplittableRandom random, double mean, double sd) {
        return mean + sd * gaussian(random);
    }

    static double logNormal(SplittableRandom random, double median, double sigma) {
        return median * StrictMath.exp(sigma * gaussian(random));
    }

    static double exponential(SplittableRandom random, double mean) {
        return -mean * StrictMath.log(1.0 - random.nextDouble());
    }

    /** Knuth's multiplication method: exact and quick for the small means used here. */
    static int poisson(SplittableRandom random, double mean) {
        if (mean <= 0) {
            return 0;
        }
        double limit = StrictMath.exp(-mean);
        double product = random.nextDouble();
        int count = 0;
        while (product > limit) {
            count++;
            product *= random.nextDouble();
        }
        return count;
    }

    /** An index drawn with probability proportional to its weight. */
    static int weighted(SplittableRandom random, double... weights) {
        double total = 0;
        for (double w : weights) {
            total += w;
        }
        double target = random.nextDouble() * total;
        for (int i = 0; i < weights.length; i++) {
            target -= weights[i];
            if (target < 0) {
                return i;
            }
        }
        return weights.length - 1;
    }

    static double roundTo(double value, int decimals) {
        double scale = StrictMath.pow(10, decimals);
        return Math.round(value * scale) / scale;
    }
}
