package dev.quern.schema;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Record;
import org.jooq.impl.DSL;

/**
 * Tells which text columns hold dates or times. SQLite has no date type, so a column declared TEXT may hold
 * {@code 2025-03-31} or {@code 2025-03-31 08:15:00}; typing it as a date lets expressions compare it with
 * the cutoff and lets min/max report it as a time. A first rows' look decides the type only: the columns
 * the recipe reads as times are checked row by row by {@link TimeSampler}.
 */
final class TextTimeDetector {

    private static final int ROWS = 200;
    private static final Pattern DATE = Pattern.compile("\\d{4}-\\d{2}-\\d{2}");
    private static final Pattern TIMESTAMP = Pattern.compile("\\d{4}-\\d{2}-\\d{2}[ T]\\d{2}:\\d{2}(:\\d{2}(\\.\\d+)?)?");

    private final DSLContext sql;

    TextTimeDetector(DSLContext sql) {
        this.sql = sql;
    }

    /** The table with its text columns of dates or times retyped. */
    TableInfo retype(TableInfo table) {
        List<String> text = table.columns().values().stream().filter(c -> c.type() == ValueType.TEXT)
                .map(ColumnInfo::name).toList();
        if (text.isEmpty()) {
            return table;
        }
        List<Field<Object>> fields = text.stream().map(c -> DSL.field(DSL.name(c))).toList();
        List<List<String>> values = new ArrayList<>();
        text.forEach(c -> values.add(new ArrayList<>()));
        for (Record r : sql.select(fields).from(DSL.table(DSL.name(table.name()))).limit(ROWS).fetch()) {
            for (int i = 0; i < text.size(); i++) {
                Object v = r.get(i);
                if (v instanceof String s) {
                    values.get(i).add(s);
                } else if (v != null) {
                    values.get(i).add("\u0000");
                }
            }
        }
        Map<String, ColumnInfo> columns = new LinkedHashMap<>(table.columns());
        for (int i = 0; i < text.size(); i++) {
            List<String> seen = values.get(i);
            if (seen.isEmpty()) {
                continue;
            }
            ColumnInfo c = columns.get(text.get(i));
            if (seen.stream().allMatch(s -> DATE.matcher(s).matches())) {
                columns.put(c.name(), new ColumnInfo(c.name(), ValueType.DATE, c.declaredType()));
            } else if (seen.stream().allMatch(s -> DATE.matcher(s).matches() || TIMESTAMP.matcher(s).matches())) {
                columns.put(c.name(), new ColumnInfo(c.name(), ValueType.TIMESTAMP, c.declaredType()));
            }
        }
        return new TableInfo(table.name(), columns);
    }
}
