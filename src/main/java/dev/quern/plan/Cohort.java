package dev.quern.plan;

import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Which (entity, cutoff) pairs become rows: every entity of {@code table} whose {@code since} is on or
 * before the cutoff day, and which has no row in any exit table at or before the end of that day.
 */
public record Cohort(String table, String alias, ColumnRef key, Optional<TimeRef> since, List<Exit> exits) {

    /** A table whose first row for an entity takes it out of the cohort (a cancellation). */
    public record Exit(String table, String alias, ColumnRef entityLink, TimeRef time) {
        public Exit {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(alias, "alias");
            Objects.requireNonNull(entityLink, "entityLink");
            Objects.requireNonNull(time, "time");
        }
    }

    public Cohort {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(alias, "alias");
        Objects.requireNonNull(key, "key");
        Objects.requireNonNull(since, "since");
        exits = List.copyOf(exits);
    }

    public ValueType keyType() {
        return key.type();
    }
}
