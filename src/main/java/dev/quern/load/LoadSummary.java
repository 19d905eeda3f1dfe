package dev.quern.load;

import java.time.Duration;
import java.util.List;
import java.util.Objects;

/** What a load did: the target (in its printable form, without credentials) and each table copied. */
public record LoadSummary(String target, List<LoadedTable> tables, Duration time) {
    public LoadSummary {
        Objects.requireNonNull(target, "target");
        tables = List.copyOf(tables);
        Objects.requireNonNull(time, "time");
    }

    public long rows() {
        return tables.stream().mapToLong(LoadedTable::rows).sum();
    }
}
