package dev.quern.schema;

import java.util.Objects;

/** A column as the source's catalogue describes it. */
public record ColumnInfo(String name, ValueType type, String declaredType) {
    public ColumnInfo {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(declaredType, "declaredType");
    }
}
