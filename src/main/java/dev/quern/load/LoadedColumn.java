package dev.quern.load;

import java.util.Objects;

/** One copied column: its SQLite declaration, what its values are and the type it was given. */
public record LoadedColumn(String name, String declaredType, ColumnKind kind, String targetType) {
    public LoadedColumn {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(declaredType, "declaredType");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(targetType, "targetType");
    }
}
