package dev.quern.recipe;

import dev.quern.Position;
import java.util.Objects;
import java.util.Optional;

/**
 * The value to predict, computed from the rows of {@code from} in the horizon
 * {@code (cutoff + gap, cutoff + gap + horizon]} that meet {@code where}.
 */
public record LabelSpec(Name name, PathSpec from, Span horizon, Span gap, Kind kind, Optional<Name> column,
                        Optional<Expression> where, Position position) {

    /** What the label says about the rows in the horizon. */
    public enum Kind {
        /** 1 when there is at least one row, else 0. */
        EXISTS("exists"),
        /** The number of rows. */
        COUNT("count"),
        /** The sum of a column, 0 when there are no rows. */
        SUM("sum");

        private final String spelling;

        Kind(String spelling) {
            this.spelling = spelling;
        }

        public String spelling() {
            return spelling;
        }
    }

    public LabelSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(horizon, "horizon");
        Objects.requireNonNull(gap, "gap");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(where, "where");
        Objects.requireNonNull(position, "position");
        if ((kind == Kind.SUM) != column.isPresent()) {
            throw new IllegalArgumentException("a label sums a column exactly when its kind is sum");
        }
    }

    /** A label over every row of its path in the horizon. */
    public LabelSpec(Name name, PathSpec from, Span horizon, Span gap, Kind kind, Optional<Name> column,
                     Position position) {
        this(name, from, horizon, gap, kind, column, Optional.empty(), position);
    }
}
