package dev.quern.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.engines.Built;
import dev.quern.run.OutputFolder;
import dev.quern.run.ValueFormat;
import dev.quern.testing.Matrix;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.spark.sql.Row;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.Yaml;

/**
 * The demo recipe built by Spark (local mode, the sample as Parquet files) gives SQLite's matrix cell for
 * cell, within the tolerances the engine tests use, and the same leakage audit.
 */
class SparkBuildTest {

    private static Built sqlite;
    private static Built spark;
    private static Path out;

    @BeforeAll
    static void build() throws IOException {
        out = Files.createTempDirectory(Files.createDirectories(Path.of("target", "spark-tests")), "build-");
        sqlite = Built.build(SparkSample.DEMO, "jdbc:sqlite:" + SparkSample.SAMPLE, out.resolve("sqlite"));
        spark = Built.build(SparkSample.DEMO, SparkSample.source(), out.resolve("spark"));
    }

    @Test
    void demoMatrixIsSqlites() {
        assertTrue(sqlite.matrix().rows().size() > 1000, "the demo has rows to compare");
        sqlite.assertSameMatrix(spark, "the demo on Spark");
        assertEquals(sqlite.summary().compilation().plan().columns(), spark.summary().compilation().plan().columns(),
                "the data dictionary's columns");
    }

    /** Spark's own Parquet files hold the same rows as the CSV matrix, one folder per cutoff. */
    @Test
    void parquetFolderHoldsTheMatrixPartitionedByCutoff() throws IOException {
        Path parquet = out.resolve("spark").resolve(Quern.MATRIX_PARQUET);
        assertTrue(Files.isRegularFile(parquet.resolve("_SUCCESS")), "Spark's writer finished");
        List<String> cutoffs = new ArrayList<>();
        try (Stream<Path> parts = Files.list(parquet)) {
            parts.map(p -> p.getFileName().toString()).filter(n -> n.startsWith("cutoff=")).sorted()
                    .forEach(cutoffs::add);
        }
        List<String> expected = sqlite.matrix().rows().stream().map(r -> "cutoff=" + r.get("cutoff")).distinct()
                .sorted().toList();
        assertEquals(expected, cutoffs, "one folder per cutoff");

        var plan = spark.summary().compilation().plan();
        List<String> columns = spark.matrix().columns();
        List<Row> rows = SparkSample.spark().read().parquet(parquet.toAbsolutePath().toString())
                .selectExpr(columns.stream().map(c -> "`" + c + "`").toArray(String[]::new))
                .orderBy("cutoff", columns.get(0)).collectAsList();
        List<Map<String, String>> read = new ArrayList<>();
        for (Row row : rows) {
            Map<String, String> cells = new LinkedHashMap<>();
            for (int i = 0; i < columns.size(); i++) {
                cells.put(columns.get(i), ValueFormat.format(SparkValues.plain(row.get(i)), plan.columns().get(i).type()));
            }
            read.add(cells);
        }
        assertEquals(spark.matrix().rows(), read, "matrix.parquet and matrix.csv hold the same cells");
    }

    @Test
    void outputFolderHoldsNoWorkingFiles() throws IOException {
        try (Stream<Path> files = Files.list(out.resolve("spark"))) {
            assertEquals(List.of(), files.map(f -> f.getFileName().toString())
                    .filter(n -> n.startsWith(".") || n.endsWith(OutputFolder.PENDING_FOLDER)).toList());
        }
        for (String name : List.of(Quern.DICTIONARY_CSV, Quern.DICTIONARY_MD, Quern.AUDIT_JSON, Quern.AUDIT_MD,
                Quern.PROVENANCE, Quern.RULES, Quern.REPORT, Quern.MATRIX)) {
            assertTrue(Files.isRegularFile(out.resolve("spark").resolve(name)), name);
        }
    }

    /** The audit's own queries (not the compiled one) run on Spark and count what they count on SQLite. */
    @Test
    void auditCountsAreSqlites() throws IOException {
        List<Map<String, Object>> expected = checks(out.resolve("sqlite"));
        List<Map<String, Object>> actual = checks(out.resolve("spark"));
        assertEquals(expected, actual, "the audit's checks, with their evidence and counts");
        Map<String, Object> timeOrder = actual.stream().filter(c -> "time-order".equals(c.get("check")))
                .findFirst().orElseThrow();
        assertEquals("pass", timeOrder.get("result"));
        assertFalse(((String) timeOrder.get("evidence")).startsWith("0 scans"), timeOrder.get("evidence").toString());
        assertEquals(Matrix.read(out.resolve("sqlite").resolve(Quern.DICTIONARY_CSV)).rows(),
                Matrix.read(out.resolve("spark").resolve(Quern.DICTIONARY_CSV)).rows(), "the data dictionary");
    }

    @SuppressWarnings("unchecked")
    private static List<Map<String, Object>> checks(Path build) throws IOException {
        Map<String, Object> audit = new Yaml().load(Files.readString(build.resolve(Quern.AUDIT_JSON)));
        return (List<Map<String, Object>>) audit.get("checks");
    }
}
