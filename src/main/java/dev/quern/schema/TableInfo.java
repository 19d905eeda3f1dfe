package dev.quern.schema;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/** A table as the source's catalogue describes it, its columns in catalogue order. */
public record TableInfo(String name, Map<String, ColumnInfo> columns) {
    public TableInfo {
        Objects.requireNonNull(name, "name");
        columns = Collections.unmodifiableMap(new LinkedHashMap<>(columns));
    }

    public Optional<ColumnInfo> column(String column) {
        return Optional.ofNullable(columns.get(column));
    }
}
