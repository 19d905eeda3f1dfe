package dev.quern.expr;

import dev.quern.QuernException;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;

/**
 * The evaluator's values: whole numbers are Long, decimal numbers Double, then String, Boolean, LocalDate
 * and LocalDateTime. Reads a row's raw values into these, and orders them the way the SQL does.
 */
final class Values {

    private Values() {
    }

    /** A row's raw value for {@code binding}, as the evaluator's type for {@code type}; JDBC's forms are accepted. */
    static Object read(Binding binding, ExprType type, Object raw) {
        if (raw == null) {
            return null;
        }
        Object value = switch (type) {
            case INTEGER -> whole(raw);
            case DECIMAL -> raw instanceof Number n ? (Object) n.doubleValue() : null;
            case TEXT -> raw instanceof CharSequence s ? s.toString() : null;
            case BOOLEAN -> bool(raw);
            case DATE -> date(raw);
            case TIMESTAMP -> timestamp(raw);
            case NULL -> null;
        };
        if (value == null) {
            String shown = raw instanceof CharSequence ? "'" + raw + "'" : String.valueOf(raw);
            throw QuernException.data("column " + binding.key() + " holds " + shown + ", which is not "
                    + (type == ExprType.INTEGER ? "a whole number" : type.noun()));
        }
        return value;
    }

    private static Long whole(Object raw) {
        if (raw instanceof Long || raw instanceof Integer || raw instanceof Short || raw instanceof Byte) {
            return ((Number) raw).longValue();
        }
        try {
            if (raw instanceof BigInteger b) {
                return b.longValueExact();
            }
            if (raw instanceof BigDecimal b) {
                return b.longValueExact();
            }
            if (raw instanceof Double || raw instanceof Float) {
                double d = ((Number) raw).doubleValue();
                return d == Math.rint(d) && Math.abs(d) < 0x1p63 ? (long) d : null;
            }
        } catch (ArithmeticException e) {
            return null;
        }
        return null;
    }

    /** SQLite has no boolean type: it stores 1 and 0. */
    private static Boolean bool(Object raw) {
        if (raw instanceof Boolean b) {
            return b;
        }
        if (raw instanceof Number n && (n.doubleValue() == 0 || n.doubleValue() == 1)) {
            return n.doubleValue() == 1;
        }
        return null;
    }

    private static LocalDate date(Object raw) {
        if (raw instanceof LocalDate d) {
            return d;
        }
        if (raw instanceof LocalDateTime t) {
            return t.toLocalDate();
        }
        if (raw instanceof java.sql.Date d) {
            return d.toLocalDate();
        }
        if (raw instanceof java.sql.Timestamp t) {
            return t.toLocalDateTime().toLocalDate();
        }
        if (raw instanceof CharSequence s && s.length() >= 10) {
            try {
                return LocalDate.parse(s.subSequence(0, 10));
            } catch (DateTimeParseException e) {
                return null;
            }
        }
        return null;
    }

    private static LocalDateTime timestamp(Object raw) {
        if (raw instanceof LocalDateTime t) {
            return t;
        }
        if (raw instanceof LocalDate d) {
            return d.atStartOfDay();
        }
        if (raw instanceof OffsetDateTime t) {
            return t.toLocalDateTime();
        }
        if (raw instanceof java.sql.Timestamp t) {
            return t.toLocalDateTime();
        }
        if (raw instanceof java.sql.Date d) {
            return d.toLocalDate().atStartOfDay();
        }
        if (raw instanceof CharSequence s) {
            return isoTimestamp(s.toString());
        }
        return null;
    }

    /**
     * ISO text as SQLite keeps it: a date alone (midnight), or date, space or T, and a time; a zone suffix
     * is dropped, because times are read as stored.
     */
    private static LocalDateTime isoTimestamp(String text) {
        try {
            LocalDate day = LocalDate.parse(text.substring(0, Math.min(10, text.length())));
            if (text.length() == 10) {
                return day.atStartOfDay();
            }
            char separator = text.charAt(10);
            if (separator != ' ' && separator != 'T') {
                return null;
            }
            String time = text.substring(11).replaceFirst("(Z|[+-]\\d{2}(:?\\d{2})?)$", "");
            return LocalDateTime.of(day, LocalTime.parse(time));
        } catch (DateTimeParseException | StringIndexOutOfBoundsException e) {
            return null;
        }
    }

    /**
     * The order of two non-null values the checker allowed to be compared: numbers by value (a whole and a
     * decimal number exactly, as SQLite does), text by Unicode code point (SQLite's BINARY collation, which
     * compares UTF-8 bytes), false before true, and a timestamp against a date by its date.
     */
    static int compare(Object a, Object b) {
        if (a instanceof Number x && b instanceof Number y) {
            return compareNumbers(x, y);
        }
        if (a instanceof String x && b instanceof String y) {
            return compareText(x, y);
        }
        if (a instanceof Boolean x && b instanceof Boolean y) {
            return Boolean.compare(x, y);
        }
        if (a instanceof LocalDateTime x && b instanceof LocalDateTime y) {
            return x.compareTo(y);
        }
        if ((a instanceof LocalDate || a instanceof LocalDateTime) && (b instanceof LocalDate || b instanceof LocalDateTime)) {
            return dateOf(a).compareTo(dateOf(b));
        }
        throw new IllegalStateException("cannot compare " + a.getClass().getSimpleName() + " with "
                + b.getClass().getSimpleName());
    }

    private static int compareNumbers(Number x, Number y) {
        if (x instanceof Long a && y instanceof Long b) {
            return Long.compare(a, b);
        }
        double a = x.doubleValue();
        double b = y.doubleValue();
        if (Double.isFinite(a) && Double.isFinite(b) && (x instanceof Long || y instanceof Long)) {
            BigDecimal exactX = x instanceof Long l ? BigDecimal.valueOf(l) : new BigDecimal(a);
            BigDecimal exactY = y instanceof Long l ? BigDecimal.valueOf(l) : new BigDecimal(b);
            return exactX.compareTo(exactY);
        }
        // Not Double.compare: that puts -0.0 before 0.0, and SQL holds them equal.
        return a < b ? -1 : (a > b ? 1 : 0);
    }

    private static int compareText(String x, String y) {
        int i = 0;
        int j = 0;
        while (i < x.length() && j < y.length()) {
            int a = x.codePointAt(i);
            int b = y.codePointAt(j);
            if (a != b) {
                return Integer.compare(a, b);
            }
            i += Character.charCount(a);
            j += Character.charCount(b);
        }
        return Boolean.compare(i < x.length(), j < y.length());
    }

    static LocalDate dateOf(Object temporal) {
        return temporal instanceof LocalDateTime t ? t.toLocalDate() : (LocalDate) temporal;
    }

    /** A number as the evaluator's form of {@code type}: a Double for DECIMAL, so 1 and 1.0 read the same. */
    static Object as(ExprType type, Object value) {
        if (type == ExprType.DECIMAL && value instanceof Long l) {
            return l.doubleValue();
        }
        return value;
    }
}
