package dev.quern.run;

import dev.quern.QuernException;
import dev.quern.plan.OutputColumn;
import dev.quern.schema.DuckDb;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import java.util.stream.Collectors;

/**
 * Writes the matrix as Parquet from its CSV, whatever engine built it: an in-memory DuckDB reads the CSV
 * with each column's type stated (never guessed) and copies it out. Integers become BIGINT, numbers DOUBLE,
 * dates DATE, times TIMESTAMP, booleans the integers 0 and 1, everything else VARCHAR; an empty cell is
 * an empty value, as in the CSV.
 */
public final class ParquetWriter {

    private ParquetWriter() {
    }

    public static void convert(Path csv, List<OutputColumn> columns, Path parquet) {
        String types = columns.stream().map(c -> literal(c.name()) + ": " + literal(duckDbType(c)))
                .collect(Collectors.joining(", ", "{", "}"));
        String sql = "copy (select * from read_csv(" + literal(csv.toString()) + ", header = true, auto_detect = false,"
                + " delim = ',', quote = '\"', escape = '\"', nullstr = '', columns = " + types + ")) to "
                + literal(parquet.toString()) + " (format parquet)";
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:", DuckDb.offline());
             Statement s = c.createStatement()) {
            s.execute(sql);
        } catch (SQLException e) {
            throw QuernException.output("writing the matrix as Parquet failed: " + e.getMessage(), e);
        }
    }

    private static String duckDbType(OutputColumn c) {
        return switch (c.type()) {
            case INTEGER, BOOLEAN -> "BIGINT";
            case DECIMAL -> "DOUBLE";
            case DATE -> "DATE";
            case TIMESTAMP -> "TIMESTAMP";
            case TEXT, OTHER -> "VARCHAR";
        };
    }

    private static String literal(String text) {
        return "'" + text.replace("'", "''") + "'";
    }
}
