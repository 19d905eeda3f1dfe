package dev.quern.encode;

import dev.quern.Position;
import java.util.Objects;

/** One checked encoding step of a column, with its options; {@code position} is where the recipe names it. */
public sealed interface Step {

    /** The step's spelling in recipes and in {@code fitted.json}. */
    String spelling();

    Position position();

    /** One 0/1 column for each of the {@code top} most frequent training levels, then "other" and "missing". */
    record OneHot(int top, Position position) implements Step {
        public OneHot {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.ONE_HOT.spelling();
        }
    }

    /** The share of training rows that hold the row's value; an empty value is a level of its own. */
    record Frequency(Position position) implements Step {
        public Frequency {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.FREQUENCY.spelling();
        }
    }

    /** The label's mean per level, smoothed toward the prior with weight {@code m}, fitted out of time. */
    record TargetMean(double m, Position position) implements Step {
        public TargetMean {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.TARGET_MEAN.spelling();
        }
    }

    /** The number (1 to {@code count}) of the quantile bin a value falls in. */
    record Bins(int count, Position position) implements Step {
        public Bins {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.BINS.spelling();
        }
    }

    /** ln(1 + x). */
    record Log1p(Position position) implements Step {
        public Log1p {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.LOG1P.spelling();
        }
    }

    /** (x - mean) / sd, with the mean and sample standard deviation of training rows. */
    record Standardise(Position position) implements Step {
        public Standardise {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.STANDARDISE.spelling();
        }
    }

    /** An extra 0/1 column, 1 when the value is empty; the value itself goes on unchanged. */
    record Missing(Position position) implements Step {
        public Missing {
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.MISSING.spelling();
        }
    }

    /** Fills empty values: with a constant, or the mean or median of training rows. */
    record Impute(Method method, double constant, Position position) implements Step {

        /** Where the filling value comes from. */
        public enum Method {
            CONSTANT("constant"), MEAN("mean"), MEDIAN("median");

            private final String spelling;

            Method(String spelling) {
                this.spelling = spelling;
            }

            public String spelling() {
                return spelling;
            }
        }

        public Impute {
            Objects.requireNonNull(method, "method");
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String spelling() {
            return Kind.IMPUTE.spelling();
        }
    }
}
