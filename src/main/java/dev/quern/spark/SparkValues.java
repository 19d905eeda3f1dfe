package dev.quern.spark;

import java.math.BigDecimal;
import java.sql.SQLException;
import java.sql.Types;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import org.apache.spark.sql.types.DataType;

/**
 * Spark's values and types in JDBC's terms. Quern's sessions set {@code spark.sql.datetime.java8API.enabled},
 * so dates arrive as {@code LocalDate}, TIMESTAMP_NTZ as {@code LocalDateTime} and TIMESTAMP as an
 * {@code Instant}, read in the session time zone Quern sets (UTC): no value passes through the JVM's zone.
 */
final class SparkValues {

    private SparkValues() {
    }

    /** The {@link Types} code for a Spark column type. */
    static int sqlType(DataType type) {
        String name = type.typeName();
        if (name.startsWith("decimal")) {
            return Types.DECIMAL;
        }
        if (name.startsWith("varchar") || name.startsWith("char")) {
            return Types.VARCHAR;
        }
        return switch (name) {
            case "long" -> Types.BIGINT;
            case "integer" -> Types.INTEGER;
            case "short" -> Types.SMALLINT;
            case "byte" -> Types.TINYINT;
            case "double" -> Types.DOUBLE;
            case "float" -> Types.REAL;
            case "string" -> Types.VARCHAR;
            case "boolean" -> Types.BOOLEAN;
            case "date" -> Types.DATE;
            case "timestamp", "timestamp_ntz" -> Types.TIMESTAMP;
            default -> Types.OTHER;
        };
    }

    /** A value of a Spark row as JDBC drivers hand it out. */
    static Object plain(Object value) {
        if (value instanceof Instant i) {
            return LocalDateTime.ofInstant(i, ZoneOffset.UTC);
        }
        if (value instanceof Float f) {
            return f.doubleValue();
        }
        return value;
    }

    static Object as(Object value, Class<?> type) throws SQLException {
        if (value == null || type == Object.class || type.isInstance(value)) {
            return value;
        }
        if (type == String.class) {
            return value.toString();
        }
        if (value instanceof Number n) {
            if (type == Long.class) {
                return n.longValue();
            }
            if (type == Integer.class) {
                return n.intValue();
            }
            if (type == Double.class) {
                return n.doubleValue();
            }
            if (type == BigDecimal.class) {
                return n instanceof BigDecimal b ? b : new BigDecimal(n.toString());
            }
        }
        if (value instanceof LocalDateTime t) {
            if (type == LocalDate.class) {
                return t.toLocalDate();
            }
            if (type == java.sql.Timestamp.class) {
                return java.sql.Timestamp.valueOf(t);
            }
            if (type == java.sql.Date.class) {
                return java.sql.Date.valueOf(t.toLocalDate());
            }
        }
        if (value instanceof LocalDate d) {
            if (type == LocalDateTime.class) {
                return d.atStartOfDay();
            }
            if (type == java.sql.Date.class) {
                return java.sql.Date.valueOf(d);
            }
            if (type == java.sql.Timestamp.class) {
                return java.sql.Timestamp.valueOf(d.atStartOfDay());
            }
        }
        throw new SQLException("cannot read a " + value.getClass().getSimpleName() + " as " + type.getSimpleName());
    }
}
