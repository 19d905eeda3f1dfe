package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Quern;
import dev.quern.sql.BlockShape;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import dev.quern.recipe.RecipeReader;
import dev.quern.testing.Matrix;
import dev.quern.testing.NistDatabase;
import java.io.IOException;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;

/**
 * Mean and sample standard deviation on SQLite, which has no stddev aggregate, against the certified
 * values of the NIST Statistical Reference Datasets, univariate summary statistics (NumAcc1-4 after
 * Simon and Lesage 1989; Michelso from Dorsey 1944). NumAcc3 and NumAcc4 break the one-pass
 * sum-of-squares formula (it gives variance 0.0115 and -2.0), so passing them shows the computation is
 * numerically stable. Tolerances follow REFERENCE-VALUES.md: even exact arithmetic on the parsed doubles
 * gives relative error 5.6e-9 on NumAcc4 and 3.5e-10 on NumAcc3.
 */
class NistStddevTest {

    @TempDir
    static Path folder;

    static final java.util.Map<BlockShape, Matrix> matrices = new java.util.EnumMap<>(BlockShape.class);

    @BeforeAll
    static void build() throws IOException {
        NistDatabase.write(folder.resolve("nist.sqlite"));
        String recipe = """
                recipe: nist
                source: jdbc:sqlite:nist.sqlite
                entity: { table: sensors, key: sensor_id, since: installed_on }
                cutoffs: { dates: [2025-01-31] }
                tables:
                  readings: { key: reading_id, time: taken_at, links: { sensor_id: sensors } }
                features:
                  - from: readings
                    windows: [365d]
                    measures: [count, mean(value), stddev(value)]
                """;
        // Every shape computes its own means and deviations, so each must meet the certified values.
        for (BlockShape shape : BlockShape.values()) {
            Path out = folder.resolve("out-" + shape.spelling());
            Quern.of(RecipeReader.parse("nist.yaml", recipe), folder).withShape(shape).build(out, Progress.SILENT);
            matrices.put(shape, Matrix.read(out.resolve("matrix.csv")));
        }
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void numAcc1(BlockShape shape) {
        check(shape, 1, 3, 10000002.0, 1.0, 1e-9);
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void numAcc2(BlockShape shape) {
        check(shape, 2, 1001, 1.2, 0.1, 1e-9);
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void numAcc3(BlockShape shape) {
        check(shape, 3, 1001, 1000000.2, 0.1, 1e-9);
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void numAcc4(BlockShape shape) {
        check(shape, 4, 1001, 10000000.2, 0.1, 1e-8);
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void michelso(BlockShape shape) {
        check(shape, 5, 100, 299.852400000000, 0.0790105478190518, 1e-9);
    }

    private static void check(BlockShape shape, int sensor, int n, double certifiedMean, double certifiedSd,
                              double relative) {
        var row = matrices.get(shape).row(Integer.toString(sensor), "2025-01-31");
        assertEquals(Integer.toString(n), row.get("readings_count_365d"));
        double mean = Double.parseDouble(row.get("readings_mean_value_365d"));
        double sd = Double.parseDouble(row.get("readings_stddev_value_365d"));
        assertEquals(certifiedMean, mean, Math.abs(certifiedMean) * 1e-12, "mean of data set " + sensor);
        assertEquals(certifiedSd, sd, certifiedSd * relative, "sample standard deviation of data set " + sensor);
    }
}
