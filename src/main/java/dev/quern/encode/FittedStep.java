package dev.quern.encode;

import java.util.List;
import java.util.Objects;

/**
 * What fitting one step on the training rows produced: every value needed to apply the step again, on
 * this build's rows or on a later month's. Written to and read from {@code fitted.json}.
 */
public sealed interface FittedStep {

    /** A level of a category as fitted: its text, how many training rows held it, and its output column. */
    record Level(String level, long rows, String column) {
        public Level {
            Objects.requireNonNull(level, "level");
            Objects.requireNonNull(column, "column");
        }
    }

    /**
     * The {@code top} most frequent non-empty levels of {@code rows} training rows, most frequent first (ties
     * by text), each with its 0/1 column; {@code otherRows} held another non-empty value, {@code emptyRows}
     * none.
     */
    record OneHot(int top, long rows, List<Level> levels, long otherRows, String otherColumn, long emptyRows,
                  String missingColumn) implements FittedStep {
        public OneHot {
            levels = List.copyOf(levels);
            Objects.requireNonNull(otherColumn, "otherColumn");
            Objects.requireNonNull(missingColumn, "missingColumn");
        }
    }

    /** A level with the share of training rows that hold it. */
    record Share(String level, long rows, double share) {
        public Share {
            Objects.requireNonNull(level, "level");
        }
    }

    /** The share of the {@code rows} training rows holding each level; {@code empty} is the empty value's. */
    record Frequency(long rows, List<Share> levels, Share empty) implements FittedStep {
        public Frequency {
            levels = List.copyOf(levels);
            Objects.requireNonNull(empty, "empty");
        }
    }

    /** A level with its labelled training rows, their label mean and the smoothed value it encodes to. */
    record LevelMean(String level, long rows, double labelMean, double value) {
        public LevelMean {
            Objects.requireNonNull(level, "level");
        }
    }

    /**
     * The frozen target mean: over the {@code labelledRows} training rows with a label, each level's
     * m-estimate (n * mean + m * prior) / (n + m) (Cestnik 1990) with {@code prior} the mean label of all of
     * them; a level never seen encodes to the prior. {@code empty} is the empty value's level.
     */
    record TargetMean(double m, long labelledRows, double prior, List<LevelMean> levels, LevelMean empty)
            implements FittedStep {
        public TargetMean {
            levels = List.copyOf(levels);
            Objects.requireNonNull(empty, "empty");
        }
    }

    /** Inner bin edges, ascending; bins are (-inf, e1], (e1, e2], ..., (ek, inf), numbered from 1. */
    record Bins(int count, long rows, List<Double> edges) implements FittedStep {
        public Bins {
            edges = List.copyOf(edges);
        }
    }

    /** ln(1 + x); nothing fitted. */
    record Log1p() implements FittedStep {
    }

    /**
     * The mean and sample standard deviation of {@code rows} training values; values are divided by
     * {@code scale}, which is the standard deviation, or 1 when that is 0 or undefined (fewer than 2 values).
     */
    record Standardise(long rows, double mean, double sd, double scale) implements FittedStep {
    }

    /** The 0/1 column that says a value was empty before the steps after it. */
    record Missing(String column) implements FittedStep {
        public Missing {
            Objects.requireNonNull(column, "column");
        }
    }

    /** Empty values become {@code value}: a constant, or the training rows' mean or median. */
    record Impute(String with, long rows, double value) implements FittedStep {
        public Impute {
            Objects.requireNonNull(with, "with");
        }
    }
}
