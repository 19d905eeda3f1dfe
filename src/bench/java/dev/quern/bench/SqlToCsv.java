package dev.quern.bench;

import dev.quern.Position;
import dev.quern.recipe.Name;
import dev.quern.run.MatrixWriter;
import dev.quern.run.ValueFormat;
import dev.quern.schema.Source;
import dev.quern.schema.ValueType;
import java.io.Writer;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.sql.Statement;
import java.time.LocalDate;
import java.time.LocalDateTime;
import org.apache.commons.csv.CSVPrinter;

/**
 * Runs one SQL file on a source and writes its result to CSV as quern writes its matrix: the same
 * read-only connection ({@link Source}), the same fetch size and CSV format, each value through
 * {@link ValueFormat}. The hand-written queries and the scan floor are timed through this.
 *
 * <pre>{@code SqlToCsv SOURCE_URL QUERY.sql OUT.csv}</pre>
 */
public final class SqlToCsv {

    /** As quern's run stage fetches, so both stream the same way. */
    private static final int FETCH_SIZE = 2_000;

    private SqlToCsv() {
    }

    public static void main(String[] args) throws Exception {
        String url = args[0];
        String sql = withoutFinalSemicolon(Files.readString(Path.of(args[1]), StandardCharsets.UTF_8));
        Path out = Path.of(args[2]);
        Source source = Source.of(new Name(url, Position.NONE), Path.of("").toAbsolutePath());
        try (Connection connection = source.open();
             Writer writer = Files.newBufferedWriter(out, StandardCharsets.UTF_8);
             CSVPrinter csv = new CSVPrinter(writer, MatrixWriter.FORMAT)) {
            // As quern does: some drivers stream with a fetch size only inside a transaction.
            connection.setAutoCommit(false);
            try (Statement statement = connection.createStatement()) {
                statement.setFetchSize(FETCH_SIZE);
                try (ResultSet rs = statement.executeQuery(sql)) {
                    ResultSetMetaData meta = rs.getMetaData();
                    String[] record = new String[meta.getColumnCount()];
                    for (int i = 0; i < record.length; i++) {
                        record[i] = meta.getColumnLabel(i + 1);
                    }
                    csv.printRecord((Object[]) record);
                    int[] types = ValueFormat.readTypes(meta, source.engine());
                    while (rs.next()) {
                        for (int i = 0; i < record.length; i++) {
                            Object value = ValueFormat.read(rs, i + 1, types[i]);
                            record[i] = ValueFormat.format(value, typeOf(value));
                        }
                        csv.printRecord((Object[]) record);
                    }
                }
            } finally {
                connection.rollback();
            }
        }
    }

    /**
     * A hand-written query has no plan to say its column types; the driver's value says it, which gives
     * the text quern writes for the same value.
     */
    private static ValueType typeOf(Object value) {
        if (value instanceof Integer || value instanceof Long || value instanceof Short
                || value instanceof Byte || value instanceof BigInteger) {
            return ValueType.INTEGER;
        }
        if (value instanceof Double || value instanceof Float || value instanceof BigDecimal) {
            return ValueType.DECIMAL;
        }
        if (value instanceof LocalDate || value instanceof java.sql.Date) {
            return ValueType.DATE;
        }
        if (value instanceof LocalDateTime || value instanceof java.sql.Timestamp) {
            return ValueType.TIMESTAMP;
        }
        return ValueType.TEXT;
    }

    private static String withoutFinalSemicolon(String sql) {
        String trimmed = sql.strip();
        return trimmed.endsWith(";") ? trimmed.substring(0, trimmed.length() - 1) : trimmed;
    }
}
