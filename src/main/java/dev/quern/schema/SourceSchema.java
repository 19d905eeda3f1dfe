package dev.quern.schema;

import java.time.LocalDate;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * What the schema stage learned about the source: the tables the recipe uses, how each time column keeps
 * its values, and the last day any event table has data for.
 */
public record SourceSchema(Engine engine, Map<String, TableInfo> tables, Map<String, TimeColumnFacts> times) {

    public SourceSchema {
        Objects.requireNonNull(engine, "engine");
        tables = Collections.unmodifiableMap(new LinkedHashMap<>(tables));
        times = Collections.unmodifiableMap(new LinkedHashMap<>(times));
    }

    public TableInfo table(String name) {
        TableInfo t = tables.get(name);
        if (t == null) {
            throw new IllegalStateException("table " + name + " was not checked by the schema stage");
        }
        return t;
    }

    public ColumnInfo column(String table, String column) {
        return table(table).column(column)
                .orElseThrow(() -> new IllegalStateException("column " + table + "." + column + " was not checked"));
    }

    public TimeColumnFacts time(String table, String column) {
        TimeColumnFacts f = times.get(key(table, column));
        if (f == null) {
            throw new IllegalStateException("time column " + table + "." + column + " was not sampled");
        }
        return f;
    }

    /** The latest date found in any of the given time columns. */
    public Optional<LocalDate> latestOf(Iterable<String> tableDotColumns) {
        LocalDate latest = null;
        for (String k : tableDotColumns) {
            TimeColumnFacts f = times.get(k);
            if (f != null && f.latest().isPresent() && (latest == null || f.latest().get().isAfter(latest))) {
                latest = f.latest().get();
            }
        }
        return Optional.ofNullable(latest);
    }

    static String key(String table, String column) {
        return table + "." + column;
    }
}
