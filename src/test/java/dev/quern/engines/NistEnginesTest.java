package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Quern;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import dev.quern.testing.TestDatabase;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
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

    private static final Map<Target, Matrix> BUILT = new ConcurrentHashMap<>();
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

    private static void check(Matrix matrix, int sensor, int n, double certifiedMean, double certifiedSd,
                              double relative) {
        var row = matrix.row(Integer.toString(sensor), "2025-01-31");
        assertEquals(Integer.toString(n), row.get("readings_count_365d"));
        double mean = Double.parseDouble(row.get("readings_mean_value_365d"));
        double sd = Double.parseDouble(row.get("readings_stddev_value_365d"));
        assertEquals(certifiedMean, mean, Math.abs(certifiedMean) * 1e-12, "mean of data set " + sensor);
        assertEquals(certifiedSd, sd, certifiedSd * relative, "sample standard deviation of data set " + sensor);
    }

    private static Matrix matrix(Target target, Databases db) throws IOException {
        Path sqlite = database(db);
        Matrix m = BUILT.get(target);
        if (m == null) {
            Path out = db.folder().resolve("nist-" + target);
            Quern.of(RecipeReader.parse("nist.yaml", RECIPE), sqlite.getParent())
                    .withSource(db.loaded(target, sqlite)).build(out, Progress.SILENT);
            m = Matrix.read(out.resolve(Quern.MATRIX));
            BUILT.put(target, m);
        }
        return m;
    }

    static synchronized Path database(Databases db) throws IOException {
        if (database != null) {
            return database;
        }
        List<List<Object>> sensors = new ArrayList<>();
        List<List<Object>> readings = new ArrayList<>();
        addDataSet(1, List.of(10000001.0, 10000003.0, 10000002.0), sensors, readings);
        addDataSet(2, pairs(1.2, 1.1, 1.3), sensors, readings);
        addDataSet(3, pairs(1000000.2, 1000000.1, 1000000.3), sensors, readings);
        addDataSet(4, pairs(10000000.2, 10000000.1, 10000000.3), sensors, readings);
        addDataSet(5, michelsoValues(), sensors, readings);
        Path file = db.folder().resolve("nist.sqlite");
        try (TestDatabase t = TestDatabase.create(file)) {
            t.execute("create table sensors (sensor_id integer primary key, installed_on text)",
                    "create table readings (reading_id integer primary key,"
                            + " sensor_id integer references sensors (sensor_id), taken_at text, value real)");
            t.insert("sensors", sensors).insert("readings", readings);
        }
        database = file;
        return file;
    }

    /** The first value, then 500 times the pair: the NumAcc2-4 layout. */
    private static List<Double> pairs(double first, double low, double high) {
        List<Double> values = new ArrayList<>();
        values.add(first);
        for (int i = 0; i < 500; i++) {
            values.add(low);
            values.add(high);
        }
        return values;
    }

    private static List<Double> michelsoValues() throws IOException {
        try (InputStream in = NistEnginesTest.class.getResourceAsStream("/reference/nist-strd-michelso.txt")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines()
                    .filter(l -> !l.isBlank() && !l.startsWith("#")).map(Double::parseDouble).toList();
        }
    }

    private static void addDataSet(int sensor, List<Double> values, List<List<Object>> sensors,
                                   List<List<Object>> readings) {
        sensors.add(List.of(sensor, "2024-01-01"));
        for (int i = 0; i < values.size(); i++) {
            // Distinct seconds of one day inside the window: order does not change the result.
            String time = String.format("2025-01-15 %02d:%02d:%02d", i / 3600, (i / 60) % 60, i % 60);
            readings.add(List.of(sensor * 10000 + i, sensor, time, values.get(i)));
        }
    }
}
