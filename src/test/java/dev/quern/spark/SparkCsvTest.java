package dev.quern.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * {@code spark:csv:} infers each column's type from the files: the sample as CSV shows the same tables,
 * columns and JDBC types (dates as DATE, times as TIMESTAMP; whole numbers as integers) as the same tables as Parquet, typed by
 * {@code quern load}, and the same rows.
 */
class SparkCsvTest {

    @Test
    void csvFolderReadsAsTheParquetFolderDoes() throws SQLException {
        SparkSample.spark();
        var recipe = Quern.load(SparkSample.DEMO);
        try (Connection parquet = recipe.withSource(SparkSample.source()).source().open();
             Connection csv = recipe.withSource("spark:csv:" + SparkSample.csvFolder()).source().open()) {
            Map<String, Integer> types = columns(parquet);
            assertTrue(types.containsValue(java.sql.Types.DATE) && types.containsValue(java.sql.Types.TIMESTAMP),
                    "the sample has dates and times: " + types);
            assertEquals(types, columns(csv), "table.column: JDBC type");
            assertEquals(count(parquet, "rides"), count(csv, "rides"));
        }
    }

    private static Map<String, Integer> columns(Connection c) throws SQLException {
        Map<String, Integer> out = new TreeMap<>();
        try (ResultSet rs = c.getMetaData().getColumns(null, null, "%", "%")) {
            while (rs.next()) {
                int type = rs.getInt("DATA_TYPE");
                // Spark infers INT for whole numbers that fit 32 bits, where quern load declares BIGINT: both are
                // integers to Quern (schema.CatalogueReader), and Spark sums either as a 64-bit integer.
                out.put(rs.getString("TABLE_NAME") + "." + rs.getString("COLUMN_NAME"),
                        type == java.sql.Types.INTEGER ? java.sql.Types.BIGINT : type);
            }
        }
        return out;
    }

    private static long count(Connection c, String table) throws SQLException {
        try (var s = c.createStatement(); ResultSet rs = s.executeQuery("select count(*) from \"" + table + "\"")) {
            rs.next();
            return rs.getLong(1);
        }
    }
}
