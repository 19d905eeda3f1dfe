package dev.quern.plan;

import dev.quern.schema.ValueType;
import java.util.Objects;

/** A source column as a query reads it: the alias of its table on the path, the table, the column. */
public record ColumnRef(String alias, String table, String column, ValueType type) {
    public ColumnRef {
        Objects.requireNonNull(alias, "alias");
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(type, "type");
    }

    /** {@code rides.distance_km}: how the dictionary and lineage name it. */
    public String qualified() {
        return table + "." + column;
    }
}
