package dev.quern.plan;

import dev.quern.Position;
import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One column of the modelling table, with what the data dictionary says of it: a plain sentence, the
 * source columns it reads, its window, what an empty window gives, and the recipe line that defined it.
 */
public record OutputColumn(String name, Role role, ValueType type, String meaning, List<String> sources,
                           Optional<String> window, Optional<String> filter, String whenEmpty, Position definedAt) {
    public OutputColumn {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(role, "role");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(meaning, "meaning");
        sources = List.copyOf(sources);
        Objects.requireNonNull(window, "window");
        Objects.requireNonNull(filter, "filter");
        Objects.requireNonNull(whenEmpty, "whenEmpty");
        Objects.requireNonNull(definedAt, "definedAt");
    }
}
