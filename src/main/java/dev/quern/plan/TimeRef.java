package dev.quern.plan;

import dev.quern.schema.TimeStorage;
import java.util.Objects;

/** A time column and how it keeps its values, which decides how it is compared with a boundary. */
public record TimeRef(ColumnRef column, TimeStorage storage) {
    public TimeRef {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(storage, "storage");
    }
}
