package dev.quern.testing;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The NIST StRD univariate data sets NumAcc1-4 and Michelso (NIST Statistical Reference Datasets; NumAcc
 * after Simon and Lesage 1989, Michelso from Dorsey 1944) as a small SQLite database: one sensor per data
 * set (1 to 5), its values as readings on one day of January 2025.
 */
public final class NistDatabase {

    private NistDatabase() {
    }

    public static Path write(Path file) throws IOException {
        List<List<Object>> sensors = new ArrayList<>();
        List<List<Object>> readings = new ArrayList<>();
        add(1, List.of(10000001.0, 10000003.0, 10000002.0), sensors, readings);
        add(2, pairs(1.2, 1.1, 1.3), sensors, readings);
        add(3, pairs(1000000.2, 1000000.1, 1000000.3), sensors, readings);
        add(4, pairs(10000000.2, 10000000.1, 10000000.3), sensors, readings);
        add(5, michelso(), sensors, readings);
        try (TestDatabase db = TestDatabase.create(file)) {
            db.execute("create table sensors (sensor_id integer primary key, installed_on text)",
                    "create table readings (reading_id integer primary key,"
                            + " sensor_id integer references sensors (sensor_id), taken_at text, value real)");
            db.insert("sensors", sensors).insert("readings", readings);
        }
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

    private static List<Double> michelso() throws IOException {
        try (InputStream in = NistDatabase.class.getResourceAsStream("/reference/nist-strd-michelso.txt")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines()
                    .filter(l -> !l.isBlank() && !l.startsWith("#")).map(Double::parseDouble).toList();
        }
    }

    private static void add(int sensor, List<Double> values, List<List<Object>> sensors, List<List<Object>> readings) {
        sensors.add(List.of(sensor, "2024-01-01"));
        for (int i = 0; i < values.size(); i++) {
            // Distinct seconds of one day inside the window: order does not change the result.
            String time = String.format("2025-01-15 %02d:%02d:%02d", i / 3600, (i / 60) % 60, i % 60);
            readings.add(List.of(sensor * 10000 + i, sensor, time, values.get(i)));
        }
    }
}
