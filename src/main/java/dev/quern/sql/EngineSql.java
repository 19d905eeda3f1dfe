package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import dev.quern.schema.ValueType;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.SortField;
import org.jooq.impl.DSL;
import org.jooq.impl.SQLDataType;

/**
 * What jOOQ cannot decide for an engine: how a stored time compares with a day boundary, how whole days
 * between two dates are counted, and whether the engine's own standard deviation can be trusted. Each
 * engine overrides only what differs, with the engine fact behind it.
 */
abstract class EngineSql {

    static EngineSql of(Engine engine) {
        return switch (engine) {
            case SQLITE -> new SqliteSql();
            case POSTGRES -> new PostgresSql();
            case DUCKDB -> new DuckDbSql();
            case MARIADB, MYSQL -> new MariaDbSql(engine);
            case SPARK -> new SparkSql();
        };
    }

    abstract Engine engine();

    DSLContext context() {
        return engine().sql();
    }

    /**
     * The boundary (a date) in the form a time column of this storage compares with. Day boundaries
     * compare correctly with ISO text as text: {@code '2025-03-31 23:59:59' < '2025-04-01'}.
     */
    Field<Object> boundaryFor(Field<Object> boundary, TimeStorage storage) {
        if (storage == TimeStorage.ISO_TEXT) {
            return boundary.cast(SQLDataType.VARCHAR(10)).coerce(Object.class);
        }
        return boundary;
    }

    /** Whole days from the date of {@code time} to {@code cutoff}, as an integer. */
    abstract Field<Object> daysFrom(Field<Object> time, TimeStorage storage, Field<Object> cutoff);

    /**
     * True when the engine's sample standard deviation is computed stably; false means Quern computes it
     * in two passes (deviations from the window's mean), which survives badly conditioned data.
     */
    abstract boolean hasStableStddev();

    /** The mean of a number column: engines differ in the precision they keep for integer input. */
    Field<Object> mean(Field<Object> value) {
        return DSL.avg(value.cast(SQLDataType.DOUBLE).coerce(java.math.BigDecimal.class)).coerce(Object.class);
    }

    /**
     * Descending order with empty values last, as SQLite, MariaDB and DuckDB sort them by default: lookups
     * pick the newest row, and an empty time or key must never count as the newest.
     */
    SortField<Object> newestFirst(Field<Object> field) {
        return field.desc();
    }

    /** An output column as the final select hands it to the driver. */
    Field<Object> output(Field<Object> value, ValueType type) {
        return value;
    }

    /**
     * A row's day as an ordered scan reads it: the date part of its time, or the number {@code yyyymmdd} where
     * the driver hands dates over slowly. Ordered as the date is.
     */
    Field<Object> scanDay(Field<Object> time, TimeStorage storage) {
        return dayOf(time, storage);
    }

    /** The date part of a time, as a date. */
    Field<Object> dayOf(Field<Object> time, TimeStorage storage) {
        if (storage == TimeStorage.ISO_TEXT) {
            return DSL.substring(time.cast(SQLDataType.VARCHAR(64)), 1, 10).cast(SQLDataType.DATE).coerce(Object.class);
        }
        return time.cast(SQLDataType.DATE).coerce(Object.class);
    }
}
