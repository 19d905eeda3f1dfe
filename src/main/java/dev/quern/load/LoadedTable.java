package dev.quern.load;

import java.util.List;
import java.util.Objects;

/** One copied table: its rows, its columns in order, its primary key and the indexes created on it. */
public record LoadedTable(String name, long rows, List<LoadedColumn> columns, List<String> primaryKey,
                          List<String> indexes) {
    public LoadedTable {
        Objects.requireNonNull(name, "name");
        columns = List.copyOf(columns);
        primaryKey = List.copyOf(primaryKey);
        indexes = List.copyOf(indexes);
    }
}
