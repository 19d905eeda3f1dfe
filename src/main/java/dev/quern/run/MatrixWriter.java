package dev.quern.run;

import dev.quern.QuernException;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import dev.quern.schema.ValueType;
import dev.quern.sql.CompiledQuery;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import org.apache.commons.csv.CSVFormat;

/**
 * The run stage's core: executes the compiled query on a read-only connection and streams its rows to
 * CSV as they arrive, keeping only running statistics, so memory does not grow with the row count. Scanned
 * blocks ({@link ScannedRows}) are merged in before the rows are written.
 */
public final class MatrixWriter {

    /** Rows fetched per round trip: large enough to keep the pipe full, small enough to stay flat. */
    static final int FETCH_SIZE = 2_000;

    /**
     * RFC 4180 with a header and Unix line ends, so the file is the same on every machine. The matrix is
     * written by {@link CsvRecords}, which gives the bytes a {@code CSVPrinter} over this format gives.
     */
    public static final CSVFormat FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator('\n').get();

    private MatrixWriter() {
    }

    /**
     * Runs {@code query} and writes its rows to {@code out} as CSV in UTF-8, handing each record to {@code written}
     * as it goes (the cells' text; the array is reused for the next record).
     */
    public static RunResult write(CompiledQuery query, Connection connection, OutputStream out, Progress progress,
                                  Consumer<String[]> written) {
        List<OutputColumn> columns = query.plan().columns();
        long started = System.nanoTime();
        long[] firstRow = {0};
        try {
            boolean autoCommit = connection.getAutoCommit();
            // Some drivers (PostgreSQL) only stream with a fetch size inside a transaction.
            connection.setAutoCommit(false);
            try {
                CsvRecords csv = new CsvRecords(out);
                csv.write(columns.stream().map(OutputColumn::name).toArray(String[]::new));
                Rows rows = new Rows(columns, csv, written);
                try (WriteBehind behind = new WriteBehind(columns.size(), rows::format, rows::count)) {
                    if (query.scanned()) {
                        // The merge counts the rows; writing them out after it is quick and says nothing.
                        new ScannedRows(query).run(connection, progress, () -> firstRow[0] = System.nanoTime(),
                                behind);
                    } else {
                        read(query, connection, progress, behind, () -> firstRow[0] = System.nanoTime());
                    }
                    behind.finish();
                }
                progress.rows(rows.rows);
                csv.flush();
                long ended = System.nanoTime();
                long queryEnd = firstRow[0] == 0 ? ended : firstRow[0];
                return rows.result(Duration.ofNanos(queryEnd - started), Duration.ofNanos(ended - queryEnd));
            } finally {
                connection.rollback();
                connection.setAutoCommit(autoCommit);
            }
        } catch (SQLException e) {
            throw QuernException.data("the source could not run the compiled query: " + e.getMessage()
                    + " (see it with 'quern sql')", e);
        } catch (IOException e) {
            throw QuernException.output("writing the matrix failed: " + e.getMessage(), e);
        } catch (UncheckedIOException e) {
            throw QuernException.output("writing the matrix failed: " + e.getCause().getMessage(), e);
        }
    }

    /** The rows of a query without scanned blocks, as the engine returns them. */
    private static void read(CompiledQuery query, Connection connection, Progress progress, Consumer<Object[]> sink,
                             Runnable started) throws SQLException {
        try (Statement statement = connection.createStatement()) {
            statement.setFetchSize(FETCH_SIZE);
            try (ResultSet rs = statement.executeQuery(query.sql())) {
                started.run();
                int[] types = ValueFormat.readTypes(rs.getMetaData(), query.plan().engine());
                Object[] values = new Object[types.length];
                long rows = 0;
                while (rs.next()) {
                    for (int i = 0; i < values.length; i++) {
                        values[i] = ValueFormat.read(rs, i + 1, types[i]);
                    }
                    sink.accept(values);
                    if (++rows % FETCH_SIZE == 0) {
                        progress.rows(rows);
                    }
                }
            }
        }
    }

    /**
     * Each row as it is written: its text, the running statistics and the tallies per cutoff. {@link #format}
     * runs on the thread that reads the rows, {@link #count} on the one that writes them ({@link WriteBehind}).
     */
    private static final class Rows {
        private final List<OutputColumn> columns;
        private final CsvRecords csv;
        private final Consumer<String[]> written;
        private final List<ColumnStats> stats = new ArrayList<>();
        private final int cutoffIndex;
        private final int labelIndex;
        private final Map<String, Long> perCutoff = new LinkedHashMap<>();
        private final Map<String, ColumnStats> labelPerCutoff = new LinkedHashMap<>();
        private final ValueType[] types;
        /**
         * Each date column's last value and its text, on the formatting thread: the cutoff is the same in every
         * row of a run of rows, and a date's text is otherwise written out anew for each.
         */
        private final Object[] lastDate;
        private final String[] lastDateText;
        /** Each decimal column's recent texts, on the formatting thread; null for other columns. */
        private final DecimalTexts[] decimals;
        /** The number columns, and which cells of the record being written hold a number's text. */
        private final boolean[] numeric;
        private final boolean[] numberText;
        private long rows;

        Rows(List<OutputColumn> columns, CsvRecords csv, Consumer<String[]> written) {
            this.columns = columns;
            this.csv = csv;
            this.written = written;
            columns.forEach(c -> stats.add(new ColumnStats(c.name(), c.type())));
            this.cutoffIndex = indexOf(columns, Role.CUTOFF);
            this.labelIndex = columns.stream().map(OutputColumn::role).toList().indexOf(Role.LABEL);
            this.types = columns.stream().map(OutputColumn::type).toArray(ValueType[]::new);
            this.lastDate = new Object[types.length];
            this.lastDateText = new String[types.length];
            this.decimals = new DecimalTexts[types.length];
            this.numeric = new boolean[types.length];
            for (int i = 0; i < types.length; i++) {
                decimals[i] = types[i] == ValueType.DECIMAL ? new DecimalTexts() : null;
                numeric[i] = types[i].isNumber();
            }
            this.numberText = new boolean[types.length];
        }

        void format(Object[] values, String[] record) {
            for (int i = 0; i < record.length; i++) {
                if (types[i] == ValueType.DATE && values[i] != null && values[i].equals(lastDate[i])) {
                    record[i] = lastDateText[i];
                    continue;
                }
                if (decimals[i] != null && values[i] instanceof Double d) {
                    record[i] = decimals[i].text(d);
                    continue;
                }
                try {
                    record[i] = ValueFormat.format(values[i], types[i]);
                } catch (NumberFormatException e) {
                    throw notANumber(columns.get(i), values[i]);
                }
                if (types[i] == ValueType.DATE) {
                    lastDate[i] = values[i];
                    lastDateText[i] = record[i];
                }
            }
        }

        void count(Object[] values, String[] record) {
            for (int i = 0; i < record.length; i++) {
                stats.get(i).add(values[i], record[i]);
                // ValueFormat writes any Number in a number column as digits, a sign, a point, NaN or Infinity.
                numberText[i] = numeric[i] && values[i] instanceof Number;
            }
            try {
                csv.write(record, numberText);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            written.accept(record);
            perCutoff.merge(record[cutoffIndex], 1L, Long::sum);
            if (labelIndex >= 0) {
                OutputColumn labelColumn = columns.get(labelIndex);
                labelPerCutoff.computeIfAbsent(record[cutoffIndex],
                        c -> ColumnStats.summaryOnly(labelColumn.name(), labelColumn.type()))
                        .add(values[labelIndex], record[labelIndex]);
            }
            rows++;
        }

        /** The engine computed text for a number column: SQLite does so from text kept in a number column. */
        private static QuernException notANumber(OutputColumn column, Object value) {
            return QuernException.data("the matrix column " + column.name() + " came out as "
                    + ValueFormat.quoted(value) + ", where a number belongs: a column it is computed from holds text"
                    + " in some rows (SQLite keeps whatever is put in a column; 'quern lineage' names the column): "
                    + ValueFormat.TEXT_IN_NUMBERS_CURE);
        }

        RunResult result(Duration query, Duration write) {
            return new RunResult(rows, perCutoff, stats, query, write, labelPerCutoff);
        }
    }

    private static int indexOf(List<OutputColumn> columns, Role role) {
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).role() == role) {
                return i;
            }
        }
        throw new IllegalStateException("no " + role + " column");
    }
}
