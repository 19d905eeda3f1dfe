package dev.quern.run;

import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import java.math.BigDecimal;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.sql.SQLException;
import java.sql.Types;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;

/**
 * How values are written to the matrix: the same text for the same value whatever the engine and driver
 * returned, so matrices compare byte for byte across engines. Empty text means no value.
 */
public final class ValueFormat {

    private static final DateTimeFormatter TIMESTAMP = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss");

    /**
     * The text of the small whole numbers most cells of a matrix hold (counts, days since): one string each,
     * made once, whose hash the column statistics then compute once instead of once per cell.
     */
    private static final String[] SMALL = new String[4_096];

    static {
        for (int i = 0; i < SMALL.length; i++) {
            SMALL[i] = Integer.toString(i);
        }
    }

    private ValueFormat() {
    }

    public static String format(Object value, ValueType type) {
        if (value == null) {
            return "";
        }
        return switch (type) {
            case INTEGER -> integer(value);
            case DECIMAL -> decimal(value);
            case DATE -> date(value);
            case TIMESTAMP -> timestamp(value);
            case BOOLEAN -> bool(value);
            default -> value.toString();
        };
    }

    /**
     * How to read each column of a result: dates and times as {@code java.time} values. A
     * {@code java.sql.Timestamp} passes through the JVM's time zone, which moves a time that falls in a
     * daylight-saving gap (02:30 on a spring-forward night) by an hour. SQLite returns dates as the text
     * they are, which is read as it is.
     */
    public static int[] readTypes(ResultSetMetaData meta, Engine engine) throws SQLException {
        int[] types = new int[meta.getColumnCount()];
        for (int i = 0; i < types.length; i++) {
            types[i] = engine == Engine.SQLITE ? Types.OTHER : meta.getColumnType(i + 1);
            if (engine == Engine.DUCKDB && types[i] == Types.DATE) {
                types[i] = LOCAL_DATE;
            }
        }
        return types;
    }

    /**
     * A date column whose driver returns a {@code LocalDate} of its own: DuckDB's, which makes it from the
     * day number it holds. Asked for a {@code LocalDate}, it goes through a {@code java.sql.Date} and the
     * JVM's calendar instead: a million dates took 86 to 640 ms that way, and 26 ms as they are.
     */
    private static final int LOCAL_DATE = Integer.MIN_VALUE;

    /** One value of a result, as {@link #readTypes} says to read it. */
    public static Object read(ResultSet rs, int column, int type) throws SQLException {
        return switch (type) {
            case LOCAL_DATE -> rs.getObject(column);
            case Types.DATE -> rs.getObject(column, LocalDate.class);
            case Types.TIMESTAMP -> rs.getObject(column, LocalDateTime.class);
            default -> rs.getObject(column);
        };
    }

    /** What to do about text in a number column: the end of every message that finds some. */
    static final String TEXT_IN_NUMBERS_CURE = "set such values to numbers, or to NULL for none, in the source, or"
            + " leave those rows out with a check under rules";

    /** A value for a message: in quotes, cut short when long, so one odd cell cannot flood a terminal. */
    public static String quoted(Object value) {
        String text = String.valueOf(value);
        return "'" + (text.length() > 40 ? text.substring(0, 40) + "..." : text) + "'";
    }

    /** The value as a double, for statistics; null when it is none. */
    public static Double number(Object value) {
        if (value instanceof Number n) {
            return n.doubleValue();
        }
        if (value instanceof Boolean b) {
            return b ? 1.0 : 0.0;
        }
        if (value instanceof String s && !s.isEmpty()) {
            try {
                return Double.parseDouble(s);
            } catch (NumberFormatException e) {
                return null;
            }
        }
        return null;
    }

    private static String integer(Object value) {
        if (value instanceof Long || value instanceof Integer) {
            long n = ((Number) value).longValue();
            return n >= 0 && n < SMALL.length ? SMALL[(int) n] : Long.toString(n);
        }
        if (value instanceof BigDecimal b) {
            return b.toBigInteger().toString();
        }
        if (value instanceof Double || value instanceof Float) {
            double d = ((Number) value).doubleValue();
            if (d == Math.rint(d) && Math.abs(d) < 9.0e15) {
                return Long.toString((long) d);
            }
            return decimal(value);
        }
        return value.toString();
    }

    /** The shortest decimal that reads back as the same double, without exponent, without a trailing .0. */
    private static String decimal(Object value) {
        double d = value instanceof Number n ? n.doubleValue() : Double.parseDouble(value.toString());
        if (Double.isNaN(d) || Double.isInfinite(d)) {
            return Double.toString(d);
        }
        if (d == 0.0) {
            return "0";
        }
        // The digits Java 19 and later print, whatever Java runs Quern: the same matrix on every runtime.
        return ShortestDecimal.plain(d);
    }

    private static String date(Object value) {
        if (value instanceof java.sql.Date d) {
            return d.toLocalDate().toString();
        }
        if (value instanceof LocalDate d) {
            return d.toString();
        }
        if (value instanceof java.sql.Timestamp t) {
            return t.toLocalDateTime().toLocalDate().toString();
        }
        if (value instanceof LocalDateTime t) {
            return t.toLocalDate().toString();
        }
        return value.toString();
    }

    private static String timestamp(Object value) {
        if (value instanceof java.sql.Timestamp t) {
            return TIMESTAMP.format(t.toLocalDateTime());
        }
        if (value instanceof LocalDateTime t) {
            return TIMESTAMP.format(t);
        }
        return value.toString();
    }

    private static String bool(Object value) {
        if (value instanceof Boolean b) {
            return b ? "1" : "0";
        }
        return value.toString();
    }
}
