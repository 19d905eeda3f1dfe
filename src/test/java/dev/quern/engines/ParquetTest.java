package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import dev.quern.Quern;
import dev.quern.plan.OutputColumn;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.MatrixFormat;
import dev.quern.run.Progress;
import dev.quern.run.ValueFormat;
import dev.quern.schema.DuckDb;
import dev.quern.testing.Matrix;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * {@code --format parquet} on every engine: the NIST recipe's matrix read back from Parquet, each value
 * written as the CSV writes it, is the CSV matrix; the columns carry their types.
 */
@ExtendWith(Databases.Extension.class)
class ParquetTest {

    @ParameterizedTest(name = "{0}")
    @EnumSource(Target.class)
    void parquetHoldsTheCsvMatrixWithTypes(Target target, Databases db) throws IOException, SQLException {
        Path sqlite = NistEnginesTest.database(db);
        Quern quern = Quern.of(RecipeReader.parse("nist.yaml", NistEnginesTest.RECIPE), sqlite.getParent())
                .withSource(db.loaded(target, sqlite));
        Path csvOut = db.folder().resolve("parquet-csv-" + target);
        Path parquetOut = db.folder().resolve("parquet-" + target);
        quern.build(csvOut, Progress.SILENT);
        var built = quern.withFormat(MatrixFormat.PARQUET).build(parquetOut, Progress.SILENT);

        assertFalse(Files.exists(parquetOut.resolve(Quern.MATRIX)), "the CSV was only a working file");
        try (var files = Files.list(parquetOut)) {
            assertEquals(List.of(), files.filter(f -> f.getFileName().toString().startsWith(".")).toList(),
                    "no working file is left behind");
        }
        Matrix csv = Matrix.read(csvOut.resolve(Quern.MATRIX));
        List<OutputColumn> columns = built.compilation().plan().columns();
        List<String> types = new ArrayList<>();
        List<Map<String, String>> rows = new ArrayList<>();
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:", DuckDb.offline());
             Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("select * from read_parquet('" + parquetOut.resolve(Quern.MATRIX_PARQUET) + "')")) {
            for (int i = 1; i <= rs.getMetaData().getColumnCount(); i++) {
                types.add(rs.getMetaData().getColumnName(i) + " " + rs.getMetaData().getColumnTypeName(i));
            }
            while (rs.next()) {
                Map<String, String> row = new java.util.LinkedHashMap<>();
                for (int i = 0; i < columns.size(); i++) {
                    row.put(columns.get(i).name(), ValueFormat.format(rs.getObject(i + 1), columns.get(i).type()));
                }
                rows.add(row);
            }
        }
        assertEquals(List.of("sensor_id BIGINT", "cutoff DATE", "readings_count_365d BIGINT",
                "readings_mean_value_365d DOUBLE", "readings_stddev_value_365d DOUBLE"), types);
        assertEquals(csv.rows(), rows);
    }
}
