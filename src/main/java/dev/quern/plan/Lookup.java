package dev.quern.plan;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/** Values as of the cutoff, one scan per table however many of its columns are taken. */
public sealed interface Lookup {

    String table();

    List<LookupColumn> columns();

    /** Attributes of the entity row itself. */
    record EntityAttributes(String table, List<LookupColumn> columns) implements Lookup {
        public EntityAttributes {
            Objects.requireNonNull(table, "table");
            columns = List.copyOf(columns);
        }
    }

    /**
     * The row of a history table in force at the end of the cutoff day: {@code from} before the next day
     * starts and {@code to} empty or not before it. When several are, the latest {@code from} wins, then
     * the highest key.
     */
    record InForce(String name, String table, String alias, ColumnRef entityLink, TimeRef from, TimeRef to,
                   Optional<ColumnRef> key, List<LookupColumn> columns) implements Lookup {
        public InForce {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(alias, "alias");
            Objects.requireNonNull(entityLink, "entityLink");
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
            Objects.requireNonNull(key, "key");
            columns = List.copyOf(columns);
        }
    }

    /** The latest row of an event table at or before the end of the cutoff day, ties broken by key. */
    record Latest(String name, EventPath path, List<LookupColumn> columns) implements Lookup {
        public Latest {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(path, "path");
            columns = List.copyOf(columns);
        }

        @Override
        public String table() {
            return path.table();
        }
    }
}
