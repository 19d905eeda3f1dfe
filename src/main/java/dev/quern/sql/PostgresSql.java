package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import org.jooq.Field;
import org.jooq.SortField;

/** PostgreSQL, and DuckDB, which follows PostgreSQL's date arithmetic and aggregates. */
final class PostgresSql extends EngineSql {

    private final Engine engine;

    PostgresSql(Engine engine) {
        this.engine = engine;
    }

    @Override
    Engine engine() {
        return engine;
    }

    /** Subtracting two DATE values gives an integer number of days in both engines. */
    @Override
    Field<Object> daysFrom(Field<Object> time, TimeStorage storage, Field<Object> cutoff) {
        return org.jooq.impl.DSL.field("({0} - {1})", Object.class, cutoff, dayOf(time, storage));
    }

    /**
     * DuckDB's driver makes a {@code java.sql.Date} of each DATE through the JVM's calendar, the costliest
     * step of reading a scanned row in a profile of a million rows; an integer crosses as it is.
     */
    @Override
    Field<Object> scanDay(Field<Object> time, TimeStorage storage) {
        if (engine != Engine.DUCKDB) {
            return super.scanDay(time, storage);
        }
        return org.jooq.impl.DSL.field("(year({0}) * 10000 + month({0}) * 100 + day({0}))", Object.class,
                dayOf(time, storage));
    }

    /** PostgreSQL sorts NULL above every value, so DESC alone would put empty values first. */
    @Override
    SortField<Object> newestFirst(Field<Object> field) {
        return field.desc().nullsLast();
    }

    /** stddev_samp uses a stable update (Youngs-Cramer in PostgreSQL, Welford in DuckDB). */
    @Override
    boolean hasStableStddev() {
        return true;
    }
}
