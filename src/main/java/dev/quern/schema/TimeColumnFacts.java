package dev.quern.schema;

import java.time.LocalDate;
import java.util.Objects;
import java.util.Optional;

/** What sampling a time column found: its storage form and the first and last dates it holds. */
public record TimeColumnFacts(String table, String column, TimeStorage storage, long rows, long nulls,
                              Optional<LocalDate> earliest, Optional<LocalDate> latest) {
    public TimeColumnFacts {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(storage, "storage");
        Objects.requireNonNull(earliest, "earliest");
        Objects.requireNonNull(latest, "latest");
    }
}
