package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** DuckDB: PostgreSQL's SQL, read through a driver of its own. */
final class DuckDbSql extends PostgresSql {

    @Override
    Engine engine() {
        return Engine.DUCKDB;
    }

    /**
     * DuckDB's driver makes a {@code java.sql.Date} of each DATE through the JVM's calendar, the costliest
     * step of reading a scanned row in a profile of a million rows; an integer crosses as it is.
     */
    @Override
    Field<Object> scanDay(Field<Object> time, TimeStorage storage) {
        return DSL.field("(year({0}) * 10000 + month({0}) * 100 + day({0}))", Object.class, dayOf(time, storage));
    }
}
