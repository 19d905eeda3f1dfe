package dev.quern.encode;

import dev.quern.Position;
import dev.quern.plan.OutputColumn;
import java.util.List;
import java.util.Objects;

/**
 * The checked encoding of one column of the raw matrix: the column, its place in the raw matrix, and its
 * steps in the order they apply.
 */
public record ColumnEncoding(OutputColumn source, int index, List<Step> steps, Position position) {
    public ColumnEncoding {
        Objects.requireNonNull(source, "source");
        steps = List.copyOf(steps);
        Objects.requireNonNull(position, "position");
        if (steps.isEmpty()) {
            throw new IllegalArgumentException("an encoding needs at least one step");
        }
    }

    /** The last step: it decides what the column's main output is. */
    public Step last() {
        return steps.get(steps.size() - 1);
    }

    /** True when the chain reads and writes numbers (log1p, standardise, impute, bins). */
    public boolean numeric() {
        return steps.stream().anyMatch(s -> !(s instanceof Step.Missing) && kind(s).numeric());
    }

    static Kind kind(Step step) {
        return Kind.of(step.spelling()).orElseThrow();
    }
}
