package dev.quern.plan;

import dev.quern.recipe.LabelSpec;
import dev.quern.recipe.Span;
import dev.quern.schema.ValueType;
import java.time.LocalDate;
import java.util.Objects;
import dev.quern.expr.CheckedExpression;
import java.util.Optional;

/**
 * The label: rows of {@code path} in the horizon after the cutoff. A row's label is empty unless its
 * horizon ended on or before {@code observedThrough}, the last day the source has data for, so that nobody
 * trains on a half-observed outcome.
 */
public record LabelPlan(String column, EventPath path, Span gap, Span horizon, LabelSpec.Kind kind,
                        Optional<ColumnRef> input, Optional<CheckedExpression> filter, ValueType type,
                        Optional<LocalDate> observedThrough) {
    public LabelPlan {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(path, "path");
        Objects.requireNonNull(gap, "gap");
        Objects.requireNonNull(horizon, "horizon");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(input, "input");
        Objects.requireNonNull(filter, "filter");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(observedThrough, "observedThrough");
    }

    public Boundary.HorizonStart start() {
        return new Boundary.HorizonStart(gap);
    }

    public Boundary.HorizonEnd end() {
        return new Boundary.HorizonEnd(gap, horizon);
    }

    /** True when the whole horizon of {@code cutoff} lies within the observed data. */
    public boolean complete(LocalDate cutoff) {
        return observedThrough.map(last -> !end().at(cutoff).isAfter(last.plusDays(1))).orElse(false);
    }
}
