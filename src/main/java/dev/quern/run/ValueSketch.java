package dev.quern.run;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * The shape of one column's values in memory that does not grow with the row count: exact counts per
 * distinct value while there are few of them, and for numbers a uniform sample of fixed size.
 *
 * <p>Levels are counted exactly until {@code levelLimit} distinct values have been seen; a later, unseen
 * value is only counted as "beyond the limit" (O(1) per value, and honest about what it knows: heavy
 * hitters that first appear late are not tracked). A number column that goes beyond the limit stops
 * counting levels altogether and relies on its sample. The sample is Vitter's Algorithm R (ACM TOMS 11(1),
 * 1985): after n values each is in the sample with probability capacity / n. Its random numbers come from
 * a fixed seed, so the same values in the same order give the same sample, and reports built from it are
 * byte-identical between reruns.
 */
public final class ValueSketch {

    /** Numbers kept in the sample: deciles from 4,096 values are within about half a percentile. */
    public static final int SAMPLE_SIZE = 4_096;
    /** Distinct values counted exactly for numbers (enough for counts, flags and small integers). */
    public static final int NUMBER_LEVELS = 256;
    /** Distinct values counted exactly for text. */
    public static final int TEXT_LEVELS = 1_000;

    private static final long SEED = 0x51554552_4EL;

    /** One distinct value and how often it was seen. */
    public record Level(String value, long count) {
        public Level {
            Objects.requireNonNull(value, "value");
        }
    }

    private final boolean numeric;
    private final int levelLimit;
    private final int capacity;
    /** Each level's count in a one-element array, so counting a value seen before is one lookup. */
    private final Map<String, long[]> levels = new HashMap<>();
    private long beyondLimit;
    private long count;
    private double[] sample = new double[0];
    private int sampled;
    private final SplittableRandom random;

    private ValueSketch(boolean numeric, int levelLimit, int capacity, long seed) {
        if (levelLimit < 1 || capacity < 1) {
            throw new IllegalArgumentException("a sketch needs room for at least one value");
        }
        this.numeric = numeric;
        this.levelLimit = levelLimit;
        this.capacity = capacity;
        this.random = new SplittableRandom(seed);
    }

    /** A sketch of numbers: level counts and a sample. */
    public static ValueSketch numbers() {
        return new ValueSketch(true, NUMBER_LEVELS, SAMPLE_SIZE, SEED);
    }

    /** A sketch of text (and of dates, which are compared as text): level counts only. */
    public static ValueSketch text() {
        return new ValueSketch(false, TEXT_LEVELS, 1, SEED);
    }

    /** A numeric sketch with other limits, for tests. */
    static ValueSketch numbers(int levelLimit, int capacity) {
        return new ValueSketch(true, levelLimit, capacity, SEED);
    }

    /** A numeric sketch with its own seed, for tests of the sample's fairness. */
    static ValueSketch numbers(int levelLimit, int capacity, long seed) {
        return new ValueSketch(true, levelLimit, capacity, seed);
    }

    public boolean numeric() {
        return numeric;
    }

    /** Adds one text value (a text sketch). */
    public void add(String text) {
        count++;
        countLevel(text);
    }

    /** Adds one number, with the text it was written as (a numeric sketch). */
    public void add(String text, double value) {
        if (!numeric) {
            throw new IllegalStateException("a text sketch takes no numbers");
        }
        count++;
        if (beyondLimit == 0) {
            countLevel(text);
        } else {
            // Once a number column has more distinct values than levels, its level counts are never used
            // again (quantiles and charts come from the sample): stop hashing its values.
            beyondLimit++;
        }
        if (sampled < capacity) {
            if (sampled == sample.length) {
                sample = Arrays.copyOf(sample, Math.min(capacity, Math.max(64, sample.length * 2)));
            }
            sample[sampled++] = value;
        } else {
            long slot = random.nextLong(count);
            if (slot < capacity) {
                sample[(int) slot] = value;
            }
        }
    }

    private void countLevel(String text) {
        long[] seen = levels.get(text);
        if (seen != null) {
            seen[0]++;
        } else if (levels.size() < levelLimit) {
            levels.put(text, new long[] {1});
        } else {
            beyondLimit++;
        }
    }

    /** How many values were added. */
    public long count() {
        return count;
    }

    /** True when every value was counted in its own level. */
    public boolean levelsExact() {
        return beyondLimit == 0;
    }

    /**
     * Values not counted in a level: for text, values that arrived after the limit was reached and were
     * not among the levels seen before; for numbers, every value after the first such one.
     */
    public long beyondLimit() {
        return beyondLimit;
    }

    /** The counted levels, most frequent first, ties by value (numerically for numbers). */
    public List<Level> levels() {
        Comparator<Level> byCount = Comparator.comparingLong(Level::count).reversed();
        List<Level> out = new ArrayList<>();
        levels.forEach((v, n) -> out.add(new Level(v, n[0])));
        if (!numeric) {
            out.sort(byCount.thenComparing(Level::value));
            return out;
        }
        // Each value is read as a number once, not at every comparison of the sort.
        Map<String, Double> number = new HashMap<>();
        out.forEach(l -> number.put(l.value(), Double.parseDouble(l.value())));
        out.sort(byCount.thenComparingDouble(l -> number.get(l.value())));
        return out;
    }

    /** True when the sample holds every value added (there were at most {@link #SAMPLE_SIZE}). */
    public boolean sampleComplete() {
        return count == sampled;
    }

    /** The sampled numbers, sorted ascending. */
    public double[] sample() {
        double[] out = Arrays.copyOf(sample, sampled);
        Arrays.sort(out);
        return out;
    }

    /**
     * The {@code p}-quantile by the inverse of the empirical distribution (the smallest value with at
     * least a share {@code p} of the values at or below it; Hyndman and Fan 1996, definition 1): exact from
     * the level counts when every value was counted, else from the sample. Empty when there are no values.
     */
    public java.util.OptionalDouble quantile(double p) {
        double[] q = quantiles(new double[] {p});
        return q.length == 0 ? java.util.OptionalDouble.empty() : java.util.OptionalDouble.of(q[0]);
    }

    /** Several quantiles at once, in the order asked; empty when there are no values. */
    public double[] quantiles(double[] ps) {
        if (!numeric) {
            throw new IllegalStateException("quantiles need numbers");
        }
        if (count == 0) {
            return new double[0];
        }
        double[] out = new double[ps.length];
        if (levelsExact()) {
            // The levels by value: each read as a number once.
            double[] value = new double[levels.size()];
            long[] rows = new long[levels.size()];
            Integer[] order = new Integer[levels.size()];
            int k = 0;
            for (Map.Entry<String, long[]> level : levels.entrySet()) {
                value[k] = Double.parseDouble(level.getKey());
                rows[k] = level.getValue()[0];
                order[k] = k;
                k++;
            }
            Arrays.sort(order, Comparator.comparingDouble(j -> value[j]));
            for (int i = 0; i < ps.length; i++) {
                long rank = rank(ps[i], count);
                long seen = 0;
                for (int j : order) {
                    seen += rows[j];
                    if (seen >= rank) {
                        out[i] = value[j];
                        break;
                    }
                }
            }
        } else {
            double[] values = sample();
            for (int i = 0; i < ps.length; i++) {
                out[i] = values[(int) rank(ps[i], values.length) - 1];
            }
        }
        return out;
    }

    /** The 1-based rank of the p-quantile among n values: ceil(p n), at least 1. */
    private static long rank(double p, long n) {
        if (p < 0 || p > 1) {
            throw new IllegalArgumentException("a quantile lies in [0, 1]: " + p);
        }
        return Math.max(1, (long) Math.ceil(p * n - 1e-9));
    }
}
