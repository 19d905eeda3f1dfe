package dev.quern.run;

import java.time.Duration;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/** What executing the query produced: row counts, each column's statistics and how long it took. */
public record RunResult(long rows, Map<String, Long> rowsPerCutoff, List<ColumnStats> columns, Duration queryTime,
                        Duration writeTime) {
    public RunResult {
        rowsPerCutoff = Collections.unmodifiableMap(new LinkedHashMap<>(rowsPerCutoff));
        columns = List.copyOf(columns);
        Objects.requireNonNull(queryTime, "queryTime");
        Objects.requireNonNull(writeTime, "writeTime");
    }

    public ColumnStats column(String name) {
        return columns.stream().filter(c -> c.column().equals(name)).findFirst()
                .orElseThrow(() -> new IllegalArgumentException("no column " + name));
    }
}
