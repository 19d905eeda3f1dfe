package dev.quern.schema;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import java.sql.Connection;
import java.util.List;
import java.util.Map;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Record3;
import org.jooq.Table;
import org.jooq.impl.DSL;

/**
 * Checks that the keys other rows are joined on are unique and never empty. A repeated member key would
 * repeat that member's row at every cutoff, and a repeated station key would count rides twice, both
 * silently: so a repeat stops the build, with examples.
 */
final class KeyChecker {

    private static final int EXAMPLES = 5;

    private final DSLContext sql;

    KeyChecker(Connection connection, Engine engine) {
        this.sql = engine.sql(connection);
    }

    void checkUnique(Map<String, String> keyByTable) {
        Diagnostics problems = new Diagnostics();
        for (Map.Entry<String, String> e : keyByTable.entrySet()) {
            Table<?> table = DSL.table(DSL.name(e.getKey()));
            Field<Object> key = DSL.field(DSL.name(e.getValue()));
            Record3<Integer, Integer, Integer> r = sql.select(DSL.count(), DSL.count(key), DSL.countDistinct(key))
                    .from(table).fetchOne();
            int rows = r.value1();
            int filled = r.value2();
            int distinct = r.value3();
            String where = e.getKey() + "." + e.getValue();
            if (filled < rows) {
                problems.error(Position.NONE, where + " is empty in " + (rows - filled)
                        + " row(s); a key must identify every row");
            }
            if (distinct < filled) {
                List<?> repeats = sql.select(key).from(table).where(key.isNotNull()).groupBy(key)
                        .having(DSL.count().gt(1)).orderBy(key).limit(EXAMPLES).fetch(0);
                problems.error(Position.NONE, where + " is not unique: " + (filled - distinct)
                        + " repeated value(s), e.g. " + repeats + "; a key must identify one row: name a unique column as the key");
            }
        }
        problems.throwIfAny(Failure.DATA);
    }
}
