package dev.quern.run;

import dev.quern.QuernException;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import dev.quern.sql.CompiledQuery;
import java.io.IOException;
import java.io.Writer;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * The run stage's core: executes the compiled query on a read-only connection and streams its rows to
 * CSV as they arrive, keeping only running statistics, so memory does not grow with the row count.
 */
public final class MatrixWriter {

    /** Rows fetched per round trip: large enough to keep the pipe full, small enough to stay flat. */
    static final int FETCH_SIZE = 2_000;

    /** RFC 4180 with a header and Unix line ends, so the file is the same on every machine. */
    public static final CSVFormat FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator('\n').get();

    private MatrixWriter() {
    }

    public static RunResult write(CompiledQuery query, Connection connection, Writer out, Progress progress) {
        List<OutputColumn> columns = query.plan().columns();
        List<ColumnStats> stats = new ArrayList<>();
        columns.forEach(c -> stats.add(new ColumnStats(c.name(), c.type())));
        int cutoffIndex = indexOf(columns, Role.CUTOFF);
        int labelIndex = columns.stream().map(OutputColumn::role).toList().indexOf(Role.LABEL);
        Map<String, Long> perCutoff = new LinkedHashMap<>();
        Map<String, ColumnStats> labelPerCutoff = new LinkedHashMap<>();
        long started = System.nanoTime();
        long firstRow = 0;
        long rows = 0;
        try {
            boolean autoCommit = connection.getAutoCommit();
            // Some drivers (PostgreSQL) only stream with a fetch size inside a transaction.
            connection.setAutoCommit(false);
            try (Statement statement = connection.createStatement();
                 CSVPrinter csv = new CSVPrinter(out, FORMAT)) {
                statement.setFetchSize(FETCH_SIZE);
                csv.printRecord(query.columns());
                String[] record = new String[columns.size()];
                Object label = null;
                try (ResultSet rs = statement.executeQuery(query.sql())) {
                    firstRow = System.nanoTime();
                    int[] types = ValueFormat.readTypes(rs.getMetaData(), query.plan().engine());
                    while (rs.next()) {
                        for (int i = 0; i < record.length; i++) {
                            Object value = ValueFormat.read(rs, i + 1, types[i]);
                            if (i == labelIndex) {
                                label = value;
                            }
                            record[i] = ValueFormat.format(value, columns.get(i).type());
                            stats.get(i).add(value, record[i]);
                        }
                        csv.printRecord((Object[]) record);
                        perCutoff.merge(record[cutoffIndex], 1L, Long::sum);
                        if (labelIndex >= 0) {
                            OutputColumn labelColumn = columns.get(labelIndex);
                            labelPerCutoff.computeIfAbsent(record[cutoffIndex],
                                    c -> ColumnStats.summaryOnly(labelColumn.name(), labelColumn.type()))
                                    .add(label, record[labelIndex]);
                        }
                        if (++rows % FETCH_SIZE == 0) {
                            progress.rows(rows);
                        }
                    }
                }
                progress.rows(rows);
                csv.flush();
            } finally {
                connection.rollback();
                connection.setAutoCommit(autoCommit);
            }
        } catch (SQLException e) {
            throw QuernException.data("the source could not run the compiled query: " + e.getMessage()
                    + " (see it with 'quern sql')", e);
        } catch (IOException e) {
            throw QuernException.output("writing the matrix failed: " + e.getMessage(), e);
        }
        long ended = System.nanoTime();
        long queryEnd = firstRow == 0 ? ended : firstRow;
        return new RunResult(rows, perCutoff, stats, Duration.ofNanos(queryEnd - started),
                Duration.ofNanos(ended - queryEnd), labelPerCutoff);
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
