package dev.quern.spark;

import java.lang.reflect.InvocationHandler;
import java.lang.reflect.Method;
import java.lang.reflect.Proxy;
import java.sql.Connection;
import java.sql.DatabaseMetaData;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.SQLFeatureNotSupportedException;
import java.sql.Statement;
import java.sql.Types;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.classic.SparkSession;
import org.apache.spark.sql.types.StructField;

/**
 * A Spark session with the recipe's tables as temporary views, shown to Quern as a read-only
 * {@link Connection}: plain statements (queries only, see {@link ReadOnlyGuard}), results streamed with
 * {@code Dataset.toLocalIterator} (one partition at a time on the driver), and a catalogue of the views.
 * Transactions do not exist in Spark; commit and rollback have nothing to do. Methods Quern does not
 * call fail with {@link SQLFeatureNotSupportedException} naming the method.
 */
final class SparkConnection implements InvocationHandler {

    private final SparkSession session;
    private final Map<String, Dataset<Row>> tables;
    private boolean autoCommit = true;
    private boolean closed;

    private SparkConnection(SparkSession session, Map<String, Dataset<Row>> tables) {
        this.session = session;
        this.tables = tables;
    }

    static Connection of(SparkSession session, Map<String, Dataset<Row>> tables) {
        return (Connection) Proxy.newProxyInstance(SparkConnection.class.getClassLoader(),
                new Class<?>[] {Connection.class}, new SparkConnection(session, tables));
    }

    /** The session behind a connection {@link #of} made, for Spark's own writer. */
    static SparkSession session(Connection connection) {
        if (Proxy.isProxyClass(connection.getClass())
                && Proxy.getInvocationHandler(connection) instanceof SparkConnection c) {
            return c.session;
        }
        throw new IllegalArgumentException("not a Spark connection");
    }

    @Override
    public Object invoke(Object proxy, Method method, Object[] args) throws Throwable {
        String name = method.getName();
        switch (name) {
            case "createStatement":
                open();
                return statement((Connection) proxy);
            case "getMetaData":
                return catalogue((Connection) proxy);
            case "getAutoCommit":
                return autoCommit;
            case "setAutoCommit":
                autoCommit = (Boolean) args[0];
                return null;
            case "commit", "rollback", "setReadOnly", "clearWarnings", "setHoldability", "setTransactionIsolation":
                return null;
            case "isReadOnly":
                return true;
            case "getCatalog", "getSchema", "getWarnings":
                return null;
            case "getTransactionIsolation":
                return Connection.TRANSACTION_NONE;
            case "nativeSQL":
                return args[0];
            case "isValid":
                return !closed;
            case "isClosed":
                return closed;
            case "close":
                close();
                return null;
            default:
                Object common = ObjectMethods.answer(name, proxy, args, "Quern's Spark connection");
                if (common != ObjectMethods.NOT_COMMON) {
                    return common;
                }
                throw new SQLFeatureNotSupportedException("Quern's Spark connection does not support " + name
                        + " (it runs plain read-only queries)");
        }
    }

    private void open() throws SQLException {
        if (closed) {
            throw new SQLException("the Spark connection is closed");
        }
    }

    /** The views belong to this connection's own session; dropping them leaves the cluster's session as it was. */
    private void close() {
        if (!closed) {
            closed = true;
            tables.keySet().forEach(t -> session.catalog().dropTempView(t));
        }
    }

    private Statement statement(Connection connection) {
        return (Statement) Proxy.newProxyInstance(SparkConnection.class.getClassLoader(),
                new Class<?>[] {Statement.class}, new InvocationHandler() {
                    private ResultSet last;
                    private boolean statementClosed;
                    private int fetchSize;

                    @Override
                    public Object invoke(Object proxy, Method method, Object[] args) throws Throwable {
                        String name = method.getName();
                        switch (name) {
                            case "executeQuery":
                                open();
                                last = query((Statement) proxy, (String) args[0], fetchSize > 0);
                                return last;
                            case "execute":
                                open();
                                last = query((Statement) proxy, (String) args[0], fetchSize > 0);
                                return true;
                            case "getResultSet":
                                return last;
                            case "getUpdateCount":
                                return -1;
                            case "getLargeUpdateCount":
                                return -1L;
                            case "getMoreResults":
                                return false;
                            case "executeUpdate", "executeLargeUpdate", "addBatch", "executeBatch",
                                 "executeLargeBatch":
                                throw new SQLException("Quern's Spark connection is read-only: " + name + " refused");
                            case "setFetchSize":
                                fetchSize = (Integer) args[0];
                                return null;
                            case "setQueryTimeout", "setMaxRows", "setLargeMaxRows",
                                 "setEscapeProcessing", "setPoolable", "closeOnCompletion", "setFetchDirection",
                                 "clearWarnings", "setMaxFieldSize", "cancel":
                                return null;
                            case "getFetchSize":
                                return fetchSize;
                            case "getQueryTimeout", "getMaxRows", "getMaxFieldSize":
                                return 0;
                            case "getWarnings":
                                return null;
                            case "getConnection":
                                return connection;
                            case "close":
                                statementClosed = true;
                                return null;
                            case "isClosed":
                                return statementClosed;
                            case "isPoolable", "isCloseOnCompletion":
                                return false;
                            default:
                                Object common = ObjectMethods.answer(name, proxy, args, "Quern's Spark statement");
                                if (common != ObjectMethods.NOT_COMMON) {
                                    return common;
                                }
                                throw new SQLFeatureNotSupportedException(
                                        "Quern's Spark statement does not support " + name);
                        }
                    }
                });
    }

    /**
     * Runs a query. With a fetch size (JDBC's hint that a result is large: the matrix writer sets one) the
     * rows are streamed with {@code toLocalIterator}, one Spark job per partition, so the driver holds one
     * partition at a time; otherwise they are collected in one job, which for the many small queries of the
     * schema, rules and audit stages is several times faster.
     */
    private ResultSet query(Statement statement, String sql, boolean stream) throws SQLException {
        ReadOnlyGuard.check(session, sql);
        Dataset<Row> result;
        try {
            result = session.sql(sql);
        } catch (RuntimeException e) {
            throw new SQLException(e.getMessage(), e);
        }
        List<Rows.Column> columns = new ArrayList<>();
        for (StructField f : result.schema().fields()) {
            columns.add(new Rows.Column(f.name(), SparkValues.sqlType(f.dataType()), f.dataType().sql()));
        }
        Iterator<Row> rows;
        try {
            rows = stream ? result.toLocalIterator() : result.collectAsList().iterator();
        } catch (RuntimeException e) {
            throw new SQLException(e.getMessage(), e);
        }
        int width = columns.size();
        Iterator<Object[]> values = new Iterator<>() {
            @Override
            public boolean hasNext() {
                return rows.hasNext();
            }

            @Override
            public Object[] next() {
                Row row = rows.next();
                Object[] out = new Object[width];
                for (int i = 0; i < width; i++) {
                    out[i] = SparkValues.plain(row.get(i));
                }
                return out;
            }
        };
        return Rows.of(columns, values, statement, () -> { });
    }

    private DatabaseMetaData catalogue(Connection connection) {
        return (DatabaseMetaData) Proxy.newProxyInstance(SparkConnection.class.getClassLoader(),
                new Class<?>[] {DatabaseMetaData.class}, (proxy, method, args) -> {
                    String name = method.getName();
                    return switch (name) {
                        case "getTables" -> tableList(matcher((String) args[2]));
                        case "getColumns" -> columnList(matcher((String) args[2]), matcher((String) args[3]));
                        case "getSearchStringEscape", "getCatalogSeparator", "getCatalogTerm" -> "";
                        case "getIdentifierQuoteString" -> "\"";
                        case "isReadOnly" -> true;
                        case "getConnection" -> connection;
                        case "getDatabaseProductName" -> "Spark SQL";
                        case "getDatabaseProductVersion" -> session.version();
                        case "getDriverName" -> "Quern's Spark connection";
                        case "getDriverVersion" -> session.version();
                        case "getJDBCMajorVersion" -> 4;
                        case "getJDBCMinorVersion" -> 2;
                        case "getURL", "getUserName" -> null;
                        case "unwrap" -> throw new SQLException("not a wrapper");
                        case "isWrapperFor" -> false;
                        case "hashCode" -> System.identityHashCode(proxy);
                        case "equals" -> proxy == args[0];
                        case "toString" -> "Quern's Spark catalogue";
                        default -> {
                            if (name.startsWith("supports") && method.getReturnType() == boolean.class) {
                                yield false;
                            }
                            throw new SQLFeatureNotSupportedException("Quern's Spark catalogue does not support " + name);
                        }
                    };
                });
    }

    /** JDBC name patterns: {@code %} any run, {@code _} one character; Quern's names are plain identifiers. */
    private static java.util.function.Predicate<String> matcher(String pattern) {
        if (pattern == null) {
            return n -> true;
        }
        StringBuilder regex = new StringBuilder();
        for (char c : pattern.toCharArray()) {
            regex.append(c == '%' ? ".*" : c == '_' ? "." : java.util.regex.Pattern.quote(String.valueOf(c)));
        }
        java.util.regex.Pattern p = java.util.regex.Pattern.compile(regex.toString());
        return n -> p.matcher(n).matches();
    }

    private ResultSet tableList(java.util.function.Predicate<String> names) {
        List<Object[]> rows = new ArrayList<>();
        for (String table : tables.keySet()) {
            if (names.test(table)) {
                rows.add(new Object[] {null, null, table, "VIEW", null});
            }
        }
        return Rows.of(Arrays.asList(text("TABLE_CAT"), text("TABLE_SCHEM"), text("TABLE_NAME"), text("TABLE_TYPE"),
                text("REMARKS")), rows.iterator(), null, () -> { });
    }

    private ResultSet columnList(java.util.function.Predicate<String> tableNames,
                                 java.util.function.Predicate<String> columnNames) {
        List<Object[]> rows = new ArrayList<>();
        for (Map.Entry<String, Dataset<Row>> table : tables.entrySet()) {
            if (!tableNames.test(table.getKey())) {
                continue;
            }
            int position = 0;
            for (StructField f : table.getValue().schema().fields()) {
                position++;
                if (columnNames.test(f.name())) {
                    rows.add(new Object[] {null, null, table.getKey(), f.name(), SparkValues.sqlType(f.dataType()),
                            f.dataType().sql(), f.nullable() ? "YES" : "NO", position});
                }
            }
        }
        return Rows.of(Arrays.asList(text("TABLE_CAT"), text("TABLE_SCHEM"), text("TABLE_NAME"), text("COLUMN_NAME"),
                new Rows.Column("DATA_TYPE", Types.INTEGER, "INT"), text("TYPE_NAME"), text("IS_NULLABLE"),
                new Rows.Column("ORDINAL_POSITION", Types.INTEGER, "INT")), rows.iterator(), null, () -> { });
    }

    private static Rows.Column text(String label) {
        return new Rows.Column(label, Types.VARCHAR, "STRING");
    }
}
