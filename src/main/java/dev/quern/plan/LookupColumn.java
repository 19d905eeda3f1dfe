package dev.quern.plan;

import java.util.Objects;

/** An output column that takes one source column's value as of the cutoff. */
public record LookupColumn(String column, ColumnRef source) {
    public LookupColumn {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(source, "source");
    }
}
