package dev.quern.run;

import java.time.Duration;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * What executing the query produced: row counts, each column's statistics, the label's tally per cutoff
 * (keyed by the cutoff as written; empty when the plan has no label) and how long it took.
 */
public record RunResult(long rows, Map<String, Long> rowsPerCutoff, List<ColumnStats> columns, Duration queryTime,
                        Duration writeTime, Map<String, ColumnStats> labelPerCutoff) {
    public RunResult {
        rowsPerCutoff = Collections.unmodifiableMap(new LinkedHashMap<>(rowsPerCutoff));
        columns = List.copyOf(columns);
        Objects.requireNonNull(queryTime, "queryTime");
        Objects.requireNonNull(writeTime, "writeTime");
        labelPerCutoff = Collections.unmodifiableMap(new LinkedHashMap<>(labelPerCutoff));
    }

    /** A result without a per-cutoff label tally. */
    public RunResult(long rows, Map<String, Long> rowsPerCutoff, List<ColumnStats> columns, Duration queryTime,
                     Duration writeTime) {
        this(rows, rowsPerCutoff, columns, queryTime, writeTime, Map.of());
    }

    public ColumnStats column(String name) {
        return columns.stream().filter(c -> c.column().equals(name)).findFirst()
                .orElseThrow(() -> new IllegalArgumentException("no column " + name));
    }
}
