package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Quern;
import dev.quern.recipe.RecipeReader;
import dev.quern.testing.Matrix;
import dev.quern.testing.TestDatabase;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
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

    static Matrix matrix;

    @BeforeAll
    static void build() throws IOException {
        List<List<Object>> sensors = new ArrayList<>();
        List<List<Object>> readings = new ArrayList<>();
        addDataSet(1, List.of(10000001.0, 10000003.0, 10000002.0), sensors, readings);
        addDataSet(2, pairs(1.2, 1.1, 1.3), sensors, readings);
        addDataSet(3, pairs(1000000.2, 1000000.1, 1000000.3), sensors, readings);
        addDataSet(4, pairs(10000000.2, 10000000.1, 10000000.3), sensors, readings);
        addDataSet(5, michelsoValues(), sensors, readings);
        try (TestDatabase db = TestDatabase.create(folder.resolve("nist.sqlite"))) {
            db.execute("create table sensors (sensor_id integer primary key, installed_on text)",
                    "create table readings (reading_id integer primary key, sensor_id integer, taken_at text, value real)");
            db.insert("sensors", sensors).insert("readings", readings);
        }
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
        Quern.of(RecipeReader.parse("nist.yaml", recipe), folder).build(folder.resolve("out"), Progress.SILENT);
        matrix = Matrix.read(folder.resolve("out").resolve("matrix.csv"));
    }

    @Test
    void numAcc1() {
        check(1, 3, 10000002.0, 1.0, 1e-9);
    }

    @Test
    void numAcc2() {
        check(2, 1001, 1.2, 0.1, 1e-9);
    }

    @Test
    void numAcc3() {
        check(3, 1001, 1000000.2, 0.1, 1e-9);
    }

    @Test
    void numAcc4() {
        check(4, 1001, 10000000.2, 0.1, 1e-8);
    }

    @Test
    void michelso() {
        check(5, 100, 299.852400000000, 0.0790105478190518, 1e-9);
    }

    private static void check(int sensor, int n, double certifiedMean, double certifiedSd, double relative) {
        var row = matrix.row(Integer.toString(sensor), "2025-01-31");
        assertEquals(Integer.toString(n), row.get("readings_count_365d"));
        double mean = Double.parseDouble(row.get("readings_mean_value_365d"));
        double sd = Double.parseDouble(row.get("readings_stddev_value_365d"));
        assertEquals(certifiedMean, mean, Math.abs(certifiedMean) * 1e-12, "mean of data set " + sensor);
        assertEquals(certifiedSd, sd, certifiedSd * relative, "sample standard deviation of data set " + sensor);
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
        try (InputStream in = NistStddevTest.class.getResourceAsStream("/reference/nist-strd-michelso.txt")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines()
                    .filter(l -> !l.isBlank() && !l.startsWith("#")).map(Double::parseDouble).toList();
        }
    }

    private static void addDataSet(int sensor, List<Double> values, List<List<Object>> sensors,
                                   List<List<Object>> readings) {
        sensors.add(List.of(sensor, "2024-01-01"));
        for (int i = 0; i < values.size(); i++) {
            // Spread over distinct seconds of one day inside the window: order does not change the result.
            String time = String.format("2025-01-15 %02d:%02d:%02d", i / 3600, (i / 60) % 60, i % 60);
            readings.add(List.of(sensor * 10000 + i, sensor, time, values.get(i)));
        }
    }
}
