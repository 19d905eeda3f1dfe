package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Quern;
import dev.quern.sql.BlockShape;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import dev.quern.testing.NistDatabase;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Mean and sample standard deviation on every engine against the certified values of the NIST Statistical
 * Reference Datasets, univariate summary statistics: NumAcc1-4 (after Simon and Lesage 1989) and Michelso
 * (Dorsey 1944). NumAcc3 and NumAcc4 break the one-pass sum-of-squares formula, so passing them shows each
 * engine's computation is numerically stable. The readings are written to SQLite, loaded into each engine
 * with {@code quern load} (REAL becomes double precision), and built with one recipe. Tolerances as in
 * {@code NistStddevTest}: relative 1e-9, and 1e-8 for NumAcc4, whose values a double cannot hold exactly.
 */
@ExtendWith(Databases.Extension.class)
class NistEnginesTest {

    static final String RECIPE = """
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

    private static final Map<String, Matrix> BUILT = new ConcurrentHashMap<>();
    private static Path database;

    @ParameterizedTest(name = "NumAcc1 on {0}")
    @EnumSource(Target.class)
    void numAcc1(Target target, Databases db) throws IOException {
        check(matrix(target, db), 1, 3, 10000002.0, 1.0, 1e-9);
    }

    @ParameterizedTest(name = "NumAcc2 on {0}")
    @EnumSource(Target.class)
    void numAcc2(Target target, Databases db) throws IOException {
        check(matrix(target, db), 2, 1001, 1.2, 0.1, 1e-9);
    }

    @ParameterizedTest(name = "NumAcc3 on {0}")
    @EnumSource(Target.class)
    void numAcc3(Target target, Databases db) throws IOException {
        check(matrix(target, db), 3, 1001, 1000000.2, 0.1, 1e-9);
    }

    @ParameterizedTest(name = "NumAcc4 on {0}")
    @EnumSource(Target.class)
    void numAcc4(Target target, Databases db) throws IOException {
        check(matrix(target, db), 4, 1001, 10000000.2, 0.1, 1e-8);
    }

    @ParameterizedTest(name = "Michelso on {0}")
    @EnumSource(Target.class)
    void michelso(Target target, Databases db) throws IOException {
        check(matrix(target, db), 5, 100, 299.852400000000, 0.0790105478190518, 1e-9);
    }

    /** Every shape on every engine: the range join's SQL aggregates and the ordered scan's JVM ones. */
    private static void check(java.util.List<Matrix> matrices, int sensor, int n, double certifiedMean,
                              double certifiedSd, double relative) {
        for (Matrix matrix : matrices) {
            check(matrix, sensor, n, certifiedMean, certifiedSd, relative);
        }
    }

    static void check(Matrix matrix, int sensor, int n, double certifiedMean, double certifiedSd,
                              double relative) {
        var row = matrix.row(Integer.toString(sensor), "2025-01-31");
        assertEquals(Integer.toString(n), row.get("readings_count_365d"));
        double mean = Double.parseDouble(row.get("readings_mean_value_365d"));
        double sd = Double.parseDouble(row.get("readings_stddev_value_365d"));
        assertEquals(certifiedMean, mean, Math.abs(certifiedMean) * 1e-12, "mean of data set " + sensor);
        assertEquals(certifiedSd, sd, certifiedSd * relative, "sample standard deviation of data set " + sensor);
    }

    private static java.util.List<Matrix> matrix(Target target, Databases db) throws IOException {
        Path sqlite = database(db);
        java.util.List<Matrix> out = new java.util.ArrayList<>();
        for (BlockShape shape : BlockShape.values()) {
            String name = target + "-" + shape.spelling();
            Matrix m = BUILT.get(name);
            if (m == null) {
                Path folder = db.folder().resolve("nist-" + name);
                Quern.of(RecipeReader.parse("nist.yaml", RECIPE), sqlite.getParent())
                        .withSource(db.loaded(target, sqlite)).withShape(shape).build(folder, Progress.SILENT);
                m = Matrix.read(folder.resolve(Quern.MATRIX));
                BUILT.put(name, m);
            }
            out.add(m);
        }
        return out;
    }

    static synchronized Path database(Databases db) throws IOException {
        if (database != null) {
            return database;
        }
        database = NistDatabase.write(db.folder().resolve("nist.sqlite"));
        return database;
    }
}
