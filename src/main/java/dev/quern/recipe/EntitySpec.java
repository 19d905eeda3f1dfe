package dev.quern.recipe;

import dev.quern.Position;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What one row describes. An entity is eligible at a cutoff from its {@code since} date on, and until it
 * has its first row in any of the {@code until} tables (a cancellation, a closure) at or before the cutoff,
 * and while {@code where} holds for its row (which may compare with {@code cutoff}).
 */
public record EntitySpec(Name table, Name key, Optional<Name> since, List<Name> until, Optional<Expression> where,
                         Position position) {
    public EntitySpec {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(key, "key");
        Objects.requireNonNull(since, "since");
        until = List.copyOf(until);
        Objects.requireNonNull(where, "where");
        Objects.requireNonNull(position, "position");
    }

    /** An entity with no extra eligibility condition. */
    public EntitySpec(Name table, Name key, Optional<Name> since, List<Name> until, Position position) {
        this(table, key, since, until, Optional.empty(), position);
    }
}
