package dev.quern.expr;

import dev.quern.schema.Engine;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.OptionalLong;
import org.jooq.Condition;
import org.jooq.DataType;
import org.jooq.Field;
import org.jooq.impl.DSL;
import org.jooq.impl.SQLDataType;

/**
 * What jOOQ cannot decide for the expression language on one engine: how temporal literals are written,
 * date parts and day counts, rounding, and where an engine's null or division rules differ from the
 * language's. Each engine overrides only what differs, with the engine fact behind it. The SQL text in
 * templates here is ours; values reach it only as jOOQ fields, never as text.
 */
abstract class EngineFunctions {

    static EngineFunctions of(Engine engine) {
        return switch (engine) {
            case SQLITE -> new SqliteFunctions();
            case POSTGRES -> new PostgresFunctions();
            case DUCKDB -> new DuckDbFunctions();
            case MARIADB, MYSQL -> new MariaDbFunctions();
            case SPARK -> new SparkFunctions();
        };
    }

    /** A decimal literal, as decimal text ({@code 2.5}): every engine reads it back to the same double. */
    Field<Object> decimal(double value) {
        return DSL.inline(BigDecimal.valueOf(value)).coerce(Object.class);
    }

    Field<Object> date(LocalDate value) {
        return DSL.inline(value).coerce(Object.class);
    }

    Field<Object> timestamp(LocalDateTime value) {
        return DSL.inline(value).coerce(Object.class);
    }

    /** A null of a known type: PostgreSQL cannot choose among abs(integer), abs(numeric)... for an untyped null. */
    Field<Object> nullOf(ExprType type) {
        if (type == ExprType.NULL) {
            return DSL.inline((Object) null);
        }
        return DSL.castNull(dataType(type)).coerce(Object.class);
    }

    /** The date part of a timestamp, so that it compares with a date as "on that day". */
    Field<Object> dateOf(Field<Object> timestamp) {
        return timestamp.cast(SQLDataType.DATE).coerce(Object.class);
    }

    /** A timestamp in the form that orders correctly against other timestamps: native types already do. */
    Field<Object> orderableTimestamp(Field<Object> timestamp) {
        return timestamp;
    }

    /** PostgreSQL, DuckDB and SQLite divide two integers as integers (7 / 2 = 3): a double dividend avoids it. */
    Field<BigDecimal> realDividend(Field<BigDecimal> dividend) {
        return dividend.cast(SQLDataType.DOUBLE).coerce(BigDecimal.class);
    }

    /**
     * sqrt, null for a negative number instead of PostgreSQL's and DuckDB's error. The guard names its
     * argument twice (no single-use form keeps 0 and drops negatives), which {@link SqlSize} accounts for.
     */
    Field<Object> sqrt(Field<BigDecimal> x) {
        return DSL.sqrt(DSL.when(x.ge(DSL.inline(0).coerce(BigDecimal.class)), x)).coerce(Object.class);
    }

    /** Half away from zero, on the value as the engine holds it. */
    abstract Field<Object> round(Field<BigDecimal> value, OptionalLong digits);

    abstract Field<Object> year(Field<Object> time);

    abstract Field<Object> month(Field<Object> time);

    /** ISO: Monday is 1, Sunday is 7. */
    abstract Field<Object> dayOfWeek(Field<Object> time);

    abstract Field<Object> hour(Field<Object> time);

    /** Whole days from the date of {@code from} to the date of {@code to}: later minus earlier. */
    abstract Field<Object> daysBetween(Field<Object> from, ExprType fromType, Field<Object> to, ExprType toType);

    /**
     * least or greatest, null when any argument is null, like every other function of the language: so do
     * SQLite's multi-argument min() and max(), and MySQL's and MariaDB's least() and greatest().
     */
    Field<Object> extreme(boolean greatest, List<Field<Object>> arguments) {
        return plainExtreme(greatest, arguments);
    }

    private static Field<Object> plainExtreme(boolean greatest, List<Field<Object>> arguments) {
        Field<Object> first = arguments.get(0);
        Field<?>[] rest = arguments.subList(1, arguments.size()).toArray(Field<?>[]::new);
        return greatest ? DSL.greatest(first, rest) : DSL.least(first, rest);
    }

    /**
     * greatest() or least() that is null when any argument is, for engines whose own skip nulls. The guard
     * names each argument twice, which {@link SqlSize} accounts for.
     */
    final Field<Object> extremeOfAll(boolean greatest, List<Field<Object>> arguments) {
        Condition allPresent = DSL.and(arguments.stream().map(Field::isNotNull).toList());
        return DSL.when(allPresent, plainExtreme(greatest, arguments));
    }

    /** The date of a time of the given type: a timestamp's date, a date as it is. */
    final Field<Object> asDate(Field<Object> time, ExprType type) {
        return type == ExprType.TIMESTAMP ? dateOf(time) : time;
    }

    static DataType<?> dataType(ExprType type) {
        return switch (type) {
            case INTEGER -> SQLDataType.BIGINT;
            case DECIMAL -> SQLDataType.DOUBLE;
            case TEXT -> SQLDataType.VARCHAR;
            case BOOLEAN -> SQLDataType.BOOLEAN;
            case DATE -> SQLDataType.DATE;
            case TIMESTAMP -> SQLDataType.TIMESTAMP;
            case NULL -> SQLDataType.OTHER;
        };
    }

    /** {@code 2025-03-31 12:00:00}, with a fraction only when there is one. */
    static String isoText(LocalDateTime value) {
        return value.toLocalDate() + " " + DateTimeFormatter.ISO_LOCAL_TIME.format(value.toLocalTime());
    }

    static Field<Object> template(String sql, Field<?>... arguments) {
        return DSL.field(sql, Object.class, (Object[]) arguments);
    }
}
