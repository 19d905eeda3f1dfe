package dev.quern.sql;

import dev.quern.plan.Aggregate;
import dev.quern.schema.Engine;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.impl.DSL;

/**
 * On SQLite, the queries that look for text in the number columns a range join measures. SQLite keeps
 * whatever is put in a column, and its {@code sum} and {@code avg} count such text as 0 without a word, where
 * the ordered scan stops at it: each query finds the first row of a table that holds text in any of those
 * columns, so that both shapes stop alike, before the matrix is built. Other engines type their columns.
 */
public final class TextInNumbers {

    /** One table's query: its columns, in the order the query returns them. */
    public record Query(String table, List<String> columns, String sql) {
        public Query {
            columns = List.copyOf(columns);
        }
    }

    private TextInNumbers() {
    }

    public static List<Query> of(CompiledQuery query) {
        if (query.plan().engine() != Engine.SQLITE) {
            return List.of();
        }
        Map<String, Set<String>> columns = new LinkedHashMap<>();
        for (ShapeChoice choice : query.choices()) {
            if (choice.shape() != BlockShape.RANGE_JOIN) {
                continue;
            }
            for (Aggregate a : choice.block().aggregates()) {
                a.input().filter(c -> c.type().isNumber()).ifPresent(c ->
                        columns.computeIfAbsent(c.table(), t -> new LinkedHashSet<>()).add(c.column()));
            }
        }
        DSLContext sql = EngineSql.of(Engine.SQLITE).context();
        List<Query> out = new ArrayList<>();
        columns.forEach((table, names) -> {
            List<Field<Object>> fields = names.stream().map(Names::field).toList();
            Condition text = DSL.falseCondition();
            for (Field<Object> f : fields) {
                text = text.or(DSL.function("typeof", String.class, f).in(DSL.inline("text"), DSL.inline("blob")));
            }
            out.add(new Query(table, List.copyOf(names),
                    sql.renderInlined(DSL.select(fields).from(Names.table(table)).where(text).limit(1))));
        });
        return out;
    }
}
