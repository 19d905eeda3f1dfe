package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import org.jooq.Field;
import org.jooq.SortField;

/** PostgreSQL, and the base of DuckDB, which follows PostgreSQL's date arithmetic and aggregates. */
class PostgresSql extends EngineSql {

    @Override
    Engine engine() {
        return Engine.POSTGRES;
    }

    /** Subtracting two DATE values gives an integer number of days in both engines. */
    @Override
    Field<Object> daysFrom(Field<Object> time, TimeStorage storage, Field<Object> cutoff) {
        return org.jooq.impl.DSL.field("({0} - {1})", Object.class, cutoff, dayOf(time, storage));
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
