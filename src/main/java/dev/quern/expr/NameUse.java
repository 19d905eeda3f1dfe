package dev.quern.expr;

import dev.quern.Position;
import java.util.Objects;
import java.util.Optional;

/** A name as an expression writes it, before it is resolved: for ordering derived columns, and lineage. */
public record NameUse(Optional<String> qualifier, String name, Position position) {

    public NameUse {
        Objects.requireNonNull(qualifier, "qualifier");
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(position, "position");
    }

    /** As written: {@code rides.distance_km} or {@code spend_30d}. */
    public String written() {
        return qualifier.map(q -> q + "." + name).orElse(name);
    }
}
