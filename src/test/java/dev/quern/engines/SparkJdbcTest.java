package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Compilation;
import dev.quern.Failure;
import dev.quern.Quern;
import dev.quern.QuernException;
import dev.quern.schema.ColumnInfo;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.ValueType;
import dev.quern.spark.SparkSample;
import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

/**
 * {@code spark:jdbc:} reads a database server through Spark's JDBC data source: the schema stage (catalogue,
 * time storage, date ranges, read by queries Spark runs) sees in the sample on PostgreSQL what Quern's own
 * PostgreSQL connection sees.
 */
@ExtendWith(Databases.Extension.class)
class SparkJdbcTest {

    @Test
    void schemaThroughSparkIsPostgresOwn(Databases db) {
        SparkSample.spark();
        String postgres = db.sample(Target.POSTGRES);
        Compilation direct = Quern.load(Databases.DEMO).withSource(postgres).compile();
        Compilation viaSpark = Quern.load(Databases.DEMO).withSource("spark:jdbc:" + postgres).compile();

        assertEquals(types(direct.schema()), types(viaSpark.schema()), "tables, columns and their types");
        assertEquals(direct.schema().times(), viaSpark.schema().times(), "time storage and date ranges");
        assertTrue(viaSpark.query().sql().contains("datediff("), "rendered for Spark");
    }

    @Test
    void fileDatabasesAreNotReadThroughSparkJdbc() {
        QuernException e = org.junit.jupiter.api.Assertions.assertThrows(QuernException.class, () ->
                Quern.load(Databases.DEMO).withSource("spark:jdbc:jdbc:sqlite:" + Databases.SAMPLE).compile());
        assertEquals(Failure.RECIPE, e.failure());
        assertTrue(e.getMessage().contains("spark:parquet:"), e.getMessage());
    }

    private static Map<String, Map<String, ValueType>> types(SourceSchema schema) {
        Map<String, Map<String, ValueType>> out = new LinkedHashMap<>();
        schema.tables().forEach((name, table) -> {
            Map<String, ValueType> columns = new LinkedHashMap<>();
            for (ColumnInfo c : table.columns().values()) {
                columns.put(c.name(), c.type());
            }
            out.put(name, columns);
        });
        return new java.util.TreeMap<>(out);
    }
}
