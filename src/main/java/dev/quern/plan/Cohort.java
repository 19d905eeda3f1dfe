package dev.quern.plan;

import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Objects;
import dev.quern.expr.CheckedExpression;
import java.util.Optional;

/**
 * Which (entity, cutoff) pairs become rows: every entity of {@code table} whose {@code since} is on or
 * before the cutoff day, which has no row in any exit table at or before the end of that day, and whose row
 * meets {@code filter} at that cutoff.
 */
public record Cohort(String table, String alias, ColumnRef key, Optional<TimeRef> since, List<Exit> exits,
                     Optional<CheckedExpression> filter) {

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
        Objects.requireNonNull(filter, "filter");
    }

    public ValueType keyType() {
        return key.type();
    }
}
