package dev.quern.recipe;

import dev.quern.Position;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/** One entry of the recipe's feature list. */
public sealed interface FeatureSpec {

    Position position();

    /**
     * Measures over windows of one path: every window of every measure comes from the same scan of the
     * path's rows. {@code prefix} replaces the path part of generated column names.
     */
    record Aggregates(PathSpec from, List<Span> windows, List<MeasureSpec> measures, Optional<Name> prefix,
                      Optional<Expression> where, Position position) implements FeatureSpec {
        public Aggregates {
            Objects.requireNonNull(from, "from");
            windows = List.copyOf(windows);
            measures = List.copyOf(measures);
            Objects.requireNonNull(prefix, "prefix");
            Objects.requireNonNull(where, "where");
            Objects.requireNonNull(position, "position");
        }

        /** A block that reads every row of its path. */
        public Aggregates(PathSpec from, List<Span> windows, List<MeasureSpec> measures, Optional<Name> prefix,
                          Position position) {
            this(from, windows, measures, prefix, Optional.empty(), position);
        }
    }

    /**
     * A column computed from other output columns of the same row (ratios, differences, trends), after
     * every block, lookup and label value is known.
     */
    record Derived(Name name, Expression expression, Position position) implements FeatureSpec {
        public Derived {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(expression, "expression");
            Objects.requireNonNull(position, "position");
        }
    }

    /**
     * A value as of the cutoff: from a history table, the row in force at the cutoff; from an event table,
     * the latest row at or before the cutoff; from the entity table, the entity's own attribute.
     */
    record Lookup(Name table, Name column, Optional<Name> name, Position position) implements FeatureSpec {
        public Lookup {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(position, "position");
        }
    }
}
