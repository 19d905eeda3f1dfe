package dev.quern.recipe;

import dev.quern.Position;
import java.util.List;
import java.util.Objects;

/**
 * How one output column is turned into model-ready numbers: one step or a chain of steps, applied in order
 * ({@code [log1p, standardise]}). The encode stage knows the step kinds and their options and checks them.
 */
public record EncodingSpec(Name column, List<Step> steps, Position position) {

    /** One encoding step: its kind as written ({@code one-hot}) and its options ({@code top: 5}). */
    public record Step(Name kind, java.util.Map<String, Name> options, Position position) {
        public Step {
            Objects.requireNonNull(kind, "kind");
            options = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(options));
            Objects.requireNonNull(position, "position");
        }
    }

    public EncodingSpec {
        Objects.requireNonNull(column, "column");
        steps = List.copyOf(steps);
        Objects.requireNonNull(position, "position");
    }
}
