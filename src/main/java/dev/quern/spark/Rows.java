package dev.quern.spark;

import java.lang.reflect.InvocationHandler;
import java.lang.reflect.Method;
import java.lang.reflect.Proxy;
import java.math.BigDecimal;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.sql.SQLException;
import java.sql.SQLFeatureNotSupportedException;
import java.sql.Statement;
import java.sql.Types;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.Iterator;
import java.util.List;

/**
 * A forward-only {@link ResultSet} over rows already in Java form (Spark rows converted by
 * {@link SparkValues}, or catalogue rows), with only the reading methods Quern and jOOQ call.
 */
final class Rows implements InvocationHandler {

    /** One column of a result: its label, its {@link Types} code and the type's name. */
    record Column(String label, int sqlType, String typeName) {
    }

    private final List<Column> columns;
    private final Iterator<Object[]> rows;
    private final Statement statement;
    private final Runnable onClose;
    private Object[] current;
    private boolean lastWasNull;
    private boolean closed;

    private Rows(List<Column> columns, Iterator<Object[]> rows, Statement statement, Runnable onClose) {
        this.columns = List.copyOf(columns);
        this.rows = rows;
        this.statement = statement;
        this.onClose = onClose;
    }

    static ResultSet of(List<Column> columns, Iterator<Object[]> rows, Statement statement, Runnable onClose) {
        return (ResultSet) Proxy.newProxyInstance(Rows.class.getClassLoader(), new Class<?>[] {ResultSet.class},
                new Rows(columns, rows, statement, onClose));
    }

    @Override
    public Object invoke(Object proxy, Method method, Object[] args) throws Throwable {
        String name = method.getName();
        switch (name) {
            case "next":
                current = rows.hasNext() ? rows.next() : null;
                return current != null;
            case "close":
                if (!closed) {
                    closed = true;
                    onClose.run();
                }
                return null;
            case "isClosed":
                return closed;
            case "wasNull":
                return lastWasNull;
            case "getMetaData":
                return metaData();
            case "findColumn":
                return index(args[0]);
            case "getStatement":
                return statement;
            case "getWarnings":
                return null;
            case "clearWarnings", "setFetchSize", "setFetchDirection":
                return null;
            case "getFetchSize":
                return 0;
            case "getType":
                return ResultSet.TYPE_FORWARD_ONLY;
            case "getConcurrency":
                return ResultSet.CONCUR_READ_ONLY;
            case "getHoldability":
                return ResultSet.CLOSE_CURSORS_AT_COMMIT;
            default:
                Object common = ObjectMethods.answer(name, proxy, args, "Spark rows");
                if (common != ObjectMethods.NOT_COMMON) {
                    return common;
                }
                if (name.startsWith("get") && args != null && args.length >= 1) {
                    return read(name, index(args[0]), args.length > 1 ? args[1] : null);
                }
                throw new SQLFeatureNotSupportedException("Quern's Spark result does not support " + name);
        }
    }

    private int index(Object column) throws SQLException {
        if (column instanceof Integer i) {
            return i;
        }
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).label().equalsIgnoreCase(column.toString())) {
                return i + 1;
            }
        }
        throw new SQLException("no column " + column + " in this result");
    }

    private Object read(String getter, int index, Object type) throws SQLException {
        if (current == null) {
            throw new SQLException("no current row");
        }
        Object value = current[index - 1];
        lastWasNull = value == null;
        return switch (getter) {
            case "getObject" -> type instanceof Class<?> c ? SparkValues.as(value, c) : value;
            case "getString" -> value == null ? null : value.toString();
            case "getLong" -> value == null ? 0L : ((Number) value).longValue();
            case "getInt" -> value == null ? 0 : ((Number) value).intValue();
            case "getShort" -> value == null ? (short) 0 : ((Number) value).shortValue();
            case "getByte" -> value == null ? (byte) 0 : ((Number) value).byteValue();
            case "getDouble" -> value == null ? 0.0 : ((Number) value).doubleValue();
            case "getFloat" -> value == null ? 0.0f : ((Number) value).floatValue();
            case "getBoolean" -> value != null && (Boolean) value;
            case "getBigDecimal" -> SparkValues.as(value, BigDecimal.class);
            case "getDate" -> SparkValues.as(value, java.sql.Date.class);
            case "getTimestamp" -> SparkValues.as(value, java.sql.Timestamp.class);
            default -> throw new SQLFeatureNotSupportedException("Quern's Spark result does not support " + getter);
        };
    }

    private ResultSetMetaData metaData() {
        return (ResultSetMetaData) Proxy.newProxyInstance(Rows.class.getClassLoader(),
                new Class<?>[] {ResultSetMetaData.class}, (proxy, method, args) -> {
                    String name = method.getName();
                    if (name.equals("getColumnCount")) {
                        return columns.size();
                    }
                    if (name.equals("unwrap")) {
                        throw new SQLException("not a wrapper");
                    }
                    if (name.equals("isWrapperFor")) {
                        return false;
                    }
                    if (name.equals("hashCode")) {
                        return System.identityHashCode(proxy);
                    }
                    if (name.equals("equals")) {
                        return proxy == args[0];
                    }
                    if (name.equals("toString")) {
                        return "Spark result columns";
                    }
                    Column c = columns.get((Integer) args[0] - 1);
                    return switch (name) {
                        case "getColumnLabel", "getColumnName" -> c.label();
                        case "getColumnType" -> c.sqlType();
                        case "getColumnTypeName" -> c.typeName();
                        case "getColumnClassName" -> javaClass(c.sqlType()).getName();
                        case "getPrecision", "getScale", "getColumnDisplaySize" -> 0;
                        case "isNullable" -> ResultSetMetaData.columnNullableUnknown;
                        case "getTableName", "getSchemaName", "getCatalogName" -> "";
                        case "isAutoIncrement", "isCurrency", "isWritable", "isDefinitelyWritable" -> false;
                        case "isReadOnly", "isSearchable", "isCaseSensitive", "isSigned" -> true;
                        default -> throw new SQLFeatureNotSupportedException(
                                "Quern's Spark result does not support " + name);
                    };
                });
    }

    private static Class<?> javaClass(int sqlType) {
        return switch (sqlType) {
            case Types.BIGINT -> Long.class;
            case Types.INTEGER -> Integer.class;
            case Types.DOUBLE -> Double.class;
            case Types.DECIMAL -> BigDecimal.class;
            case Types.BOOLEAN -> Boolean.class;
            case Types.DATE -> LocalDate.class;
            case Types.TIMESTAMP -> LocalDateTime.class;
            default -> String.class;
        };
    }
}
