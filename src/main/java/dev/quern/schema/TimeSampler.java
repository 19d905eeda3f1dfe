package dev.quern.schema;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Record;
import org.jooq.SelectField;
import org.jooq.impl.DSL;
import org.jooq.impl.SQLDataType;

/**
 * Finds how each time column keeps its values, with one scan per table. Text that does not start with an
 * ISO date (epoch numbers, {@code 03/31/2025}) would make window comparisons silently wrong, so it stops
 * the build with examples and a way out.
 */
final class TimeSampler {

    private static final int EXAMPLES = 3;

    private final Engine engine;
    private final DSLContext sql;

    TimeSampler(Connection connection, Engine engine) {
        this.engine = engine;
        this.sql = engine.sql(connection);
    }

    Map<String, TimeColumnFacts> sample(Map<String, Set<String>> columnsByTable, Map<String, TableInfo> tables)
            throws SQLException {
        Diagnostics problems = new Diagnostics();
        Map<String, TimeColumnFacts> facts = new LinkedHashMap<>();
        for (Map.Entry<String, Set<String>> entry : columnsByTable.entrySet()) {
            TableInfo table = tables.get(entry.getKey());
            if (table != null) {
                sampleTable(table, entry.getValue(), facts, problems);
            }
        }
        problems.throwIfAny(Failure.DATA);
        return facts;
    }

    private void sampleTable(TableInfo table, Set<String> columns, Map<String, TimeColumnFacts> facts,
                             Diagnostics problems) throws SQLException {
        List<SelectField<?>> selects = new ArrayList<>();
        selects.add(DSL.count());
        for (String column : columns) {
            Field<Object> c = DSL.field(DSL.name(column));
            Condition iso = isIsoText(c, storageOf(table, column));
            selects.add(DSL.count(c));
            selects.add(DSL.count(DSL.when(iso, DSL.inline(1))));
            // The extremes of the raw values, not of the readable ones: they are used only when every value is
            // readable, and taking the day of two values instead of every row's halves the scan on SQLite.
            selects.add(dayOf(DSL.min(c), table, column));
            selects.add(dayOf(DSL.max(c), table, column));
        }
        Record r = sql.select(selects).from(DSL.table(DSL.name(table.name()))).fetchOne();
        long rows = ((Number) r.get(0)).longValue();
        int i = 1;
        for (String column : columns) {
            long filled = ((Number) r.get(i)).longValue();
            long readable = ((Number) r.get(i + 1)).longValue();
            Optional<LocalDate> earliest = day(r.get(i + 2));
            Optional<LocalDate> latest = day(r.get(i + 3));
            i += 4;
            if (readable < filled) {
                problems.error(Position.NONE, unreadable(table.name(), column, filled - readable, examples(table, column)));
                continue;
            }
            facts.put(SourceSchema.key(table.name(), column), new TimeColumnFacts(table.name(), column,
                    storageOf(table, column), rows, rows - filled, earliest, latest));
        }
    }

    private TimeStorage storageOf(TableInfo table, String column) {
        ValueType type = table.column(column).map(ColumnInfo::type).orElse(ValueType.OTHER);
        if (engine == Engine.SQLITE) {
            return TimeStorage.ISO_TEXT;
        }
        return switch (type) {
            case DATE -> TimeStorage.NATIVE_DATE;
            case TIMESTAMP -> TimeStorage.NATIVE_TIMESTAMP;
            default -> TimeStorage.ISO_TEXT;
        };
    }

    private Condition isIsoText(Field<Object> c, TimeStorage storage) {
        if (storage != TimeStorage.ISO_TEXT) {
            return c.isNotNull();
        }
        if (engine == Engine.SQLITE) {
            // typeof guards against integers and reals, which GLOB would otherwise test as their text.
            return DSL.condition("typeof({0}) = 'text' and {0} glob '[0-9][0-9][0-9][0-9]-[0-1][0-9]-[0-3][0-9]*'", c);
        }
        return c.cast(SQLDataType.VARCHAR(64)).like("____-__-__%");
    }

    private Field<String> dayOf(Field<Object> c, TableInfo table, String column) {
        if (storageOf(table, column) == TimeStorage.ISO_TEXT) {
            return DSL.substring(c.cast(SQLDataType.VARCHAR(64)), 1, 10);
        }
        return c.cast(SQLDataType.DATE).cast(SQLDataType.VARCHAR(10));
    }

    private List<String> examples(TableInfo table, String column) throws SQLException {
        Field<Object> c = DSL.field(DSL.name(column));
        List<String> out = new ArrayList<>();
        for (Record r : sql.select(c).from(DSL.table(DSL.name(table.name())))
                .where(c.isNotNull().and(DSL.not(isIsoText(c, storageOf(table, column)))))
                .limit(EXAMPLES).fetch()) {
            Object v = r.get(0);
            out.add(v instanceof Number ? v + " (a number)" : "'" + v + "'");
        }
        return out;
    }

    private static String unreadable(String table, String column, long count, List<String> examples) {
        return table + "." + column + " has " + count + " value(s) that are not ISO dates or times, e.g. "
                + String.join(", ", examples) + ". Quern reads times stored as text starting YYYY-MM-DD"
                + " (YYYY-MM-DD, YYYY-MM-DD HH:MM:SS or YYYY-MM-DDTHH:MM:SS); point the recipe at a view that"
                + " converts them, e.g. strftime('%Y-%m-%d %H:%M:%S', " + column + ", 'unixepoch') for epoch seconds";
    }

    private static Optional<LocalDate> day(Object value) {
        if (value == null) {
            return Optional.empty();
        }
        try {
            return Optional.of(LocalDate.parse(value.toString().substring(0, 10)));
        } catch (DateTimeParseException | StringIndexOutOfBoundsException e) {
            return Optional.empty();
        }
    }
}
