package dev.quern.reference;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Assertions;

/**
 * Compares a built {@code matrix.csv} with the reference evaluator's result cell for cell: integers, text and
 * dates exactly, floating values to a relative tolerance; an empty cell is an empty value.
 */
final class MatrixComparison {

    /** Relative tolerance for floating values, and the absolute floor used near zero. */
    static final double RELATIVE = 1e-9;
    static final double ABSOLUTE_FLOOR = 1e-12;

    /** How many differences a failure lists. */
    private static final int SHOWN = 25;

    /** A matrix.csv as read: the header and the cells of each row as text. */
    record Csv(List<String> columns, List<List<String>> rows) {

        static Csv read(Path file) {
            try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8);
                 CSVParser parser = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                         .parse(in)) {
                List<List<String>> rows = new ArrayList<>();
                for (CSVRecord r : parser) {
                    rows.add(r.toList());
                }
                return new Csv(List.copyOf(parser.getHeaderNames()), rows);
            } catch (IOException e) {
                throw new IllegalStateException("reading " + file + " failed: " + e.getMessage(), e);
            }
        }

        /** The text of one cell, by entity key, cutoff and column name. */
        String cell(String key, String cutoff, String column) {
            int c = columns.indexOf(column);
            if (c < 0) {
                throw new AssertionError("no column " + column + " in " + columns);
            }
            return rows.stream().filter(r -> r.get(0).equals(key) && r.get(1).equals(cutoff)).findFirst()
                    .orElseThrow(() -> new AssertionError("no row for " + key + " at " + cutoff)).get(c);
        }

        boolean has(String key, String cutoff) {
            return rows.stream().anyMatch(r -> r.get(0).equals(key) && r.get(1).equals(cutoff));
        }
    }

    private MatrixComparison() {
    }

    /**
     * Every difference between {@code expected} and {@code actual}, described with entity, cutoff, column,
     * expected and actual value; empty when they agree.
     */
    static List<String> differences(ReferenceEvaluator.Result expected, Csv actual) {
        List<String> out = new ArrayList<>();
        if (!expected.columns().equals(actual.columns())) {
            out.add("columns differ:\n  expected " + expected.columns() + "\n  actual   " + actual.columns());
            return out;
        }
        if (expected.rows().size() != actual.rows().size()) {
            out.add("row count differs: expected " + expected.rows().size() + ", actual " + actual.rows().size());
        }
        int rows = Math.min(expected.rows().size(), actual.rows().size());
        List<String> columns = expected.columns();
        for (int r = 0; r < rows; r++) {
            List<Object> e = expected.rows().get(r);
            List<String> a = actual.rows().get(r);
            String where = "row " + (r + 1) + " (" + columns.get(0) + " " + text(e.get(0)) + ", cutoff "
                    + text(e.get(1)) + ")";
            if (!text(e.get(0)).equals(a.get(0)) || !text(e.get(1)).equals(a.get(1))) {
                out.add(where + ": the matrix has " + columns.get(0) + " " + a.get(0) + ", cutoff " + a.get(1)
                        + " here: rows differ in membership or order");
                if (out.size() >= SHOWN) {
                    return out;
                }
                continue;
            }
            for (int c = 2; c < columns.size(); c++) {
                if (!same(e.get(c), a.get(c))) {
                    out.add(where + ", column " + columns.get(c) + ": expected " + show(e.get(c)) + ", actual "
                            + show(a.get(c)));
                    if (out.size() >= SHOWN) {
                        return out;
                    }
                }
            }
        }
        return out;
    }

    /** Fails with the first differences when the matrix and the evaluator disagree anywhere. */
    static void assertMatches(ReferenceEvaluator.Result expected, Csv actual) {
        String report = report(differences(expected, actual));
        if (report != null) {
            Assertions.fail(report);
        }
    }

    /** The differences as one failure message, or null when there are none. */
    static String report(List<String> differences) {
        if (differences.isEmpty()) {
            return null;
        }
        return "the matrix differs from the reference evaluator (first " + differences.size() + "):\n  "
                + String.join("\n  ", differences);
    }

    static boolean same(Object expected, String actual) {
        if (expected == null) {
            return actual.isEmpty();
        }
        if (actual.isEmpty()) {
            return false;
        }
        if (expected instanceof Double x) {
            double y;
            try {
                y = Double.parseDouble(actual);
            } catch (NumberFormatException e) {
                return false;
            }
            return close(x, y);
        }
        return text(expected).equals(actual); // Long, String: exactly
    }

    static boolean close(double expected, double actual) {
        double tolerance = Math.max(ABSOLUTE_FLOOR, RELATIVE * Math.max(Math.abs(expected), Math.abs(actual)));
        return Math.abs(expected - actual) <= tolerance;
    }

    private static String text(Object v) {
        return v == null ? "" : v.toString();
    }

    private static String show(Object v) {
        if (v == null || (v instanceof String s && s.isEmpty())) {
            return "(empty)";
        }
        return v instanceof String ? "'" + v + "'" : v.toString();
    }
}
