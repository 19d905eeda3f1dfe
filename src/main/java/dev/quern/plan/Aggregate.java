package dev.quern.plan;

import dev.quern.recipe.MeasureKind;
import dev.quern.recipe.Span;
import dev.quern.schema.ValueType;
import java.util.Objects;
import java.util.Optional;

/** One output column of a block: a measure of one input over one window. */
public record Aggregate(String column, MeasureKind kind, Optional<ColumnRef> input, Span window, ValueType type) {
    public Aggregate {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(input, "input");
        Objects.requireNonNull(window, "window");
        Objects.requireNonNull(type, "type");
        if (kind.takesColumn() != input.isPresent()) {
            throw new IllegalArgumentException(kind.spelling() + " and its input disagree");
        }
    }
}
