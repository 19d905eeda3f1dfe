package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.fail;

import dev.quern.BuildSummary;
import dev.quern.Quern;
import dev.quern.plan.Aggregate;
import dev.quern.plan.OutputColumn;
import dev.quern.recipe.MeasureKind;
import dev.quern.run.Progress;
import dev.quern.schema.ValueType;
import dev.quern.testing.Matrix;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** A recipe built on one engine: the build's summary and its matrix read back. */
public record Built(BuildSummary summary, Matrix matrix, Path folder) {

    /** Relative tolerance for floating values, and for standard deviations, across engines (issue 5). */
    static final double FLOAT_TOLERANCE = 1e-9;
    static final double STDDEV_TOLERANCE = 1e-8;

    public static Built build(Path recipe, String source, Path out) {
        BuildSummary summary = Quern.load(recipe).withSource(source).build(out, Progress.SILENT);
        return new Built(summary, Matrix.read(out.resolve(Quern.MATRIX)), out);
    }

    /**
     * Asserts that {@code other} is the same matrix: same columns in the same order, same rows in the same
     * order; integers, text and dates exactly, floating values to {@link #FLOAT_TOLERANCE} relative
     * (standard deviations to {@link #STDDEV_TOLERANCE}).
     */
    public void assertSameMatrix(Built other, String label) {
        assertEquals(matrix.columns(), other.matrix.columns(), label + ": columns");
        assertEquals(matrix.rows().size(), other.matrix.rows().size(), label + ": rows");
        Set<String> floats = new HashSet<>();
        for (OutputColumn c : summary.compilation().plan().columns()) {
            if (c.type() == ValueType.DECIMAL) {
                floats.add(c.name());
            }
        }
        Set<String> stddevs = new HashSet<>();
        summary.compilation().plan().blocks().forEach(b -> b.aggregates().stream()
                .filter(a -> a.kind() == MeasureKind.STDDEV).map(Aggregate::column).forEach(stddevs::add));
        List<String> differences = new ArrayList<>();
        int compared = 0;
        for (int i = 0; i < matrix.rows().size(); i++) {
            Map<String, String> expected = matrix.rows().get(i);
            Map<String, String> actual = other.matrix.rows().get(i);
            for (String column : matrix.columns()) {
                String a = expected.get(column);
                String b = actual.get(column);
                compared++;
                if (a.equals(b) || floats.contains(column) && close(a, b,
                        stddevs.contains(column) ? STDDEV_TOLERANCE : FLOAT_TOLERANCE)) {
                    continue;
                }
                if (differences.size() < 10) {
                    differences.add("row " + (i + 1) + " (" + expected.get(matrix.columns().get(0)) + ", "
                            + expected.get("cutoff") + ") " + column + ": " + a + " vs " + b);
                }
            }
        }
        if (!differences.isEmpty()) {
            fail(label + ": values differ (first " + differences.size() + " of " + compared + " compared):\n  "
                    + String.join("\n  ", differences));
        }
    }

    private static boolean close(String a, String b, double relative) {
        if (a.isEmpty() || b.isEmpty()) {
            return false;
        }
        double x = Double.parseDouble(a);
        double y = Double.parseDouble(b);
        return Math.abs(x - y) <= relative * Math.max(Math.abs(x), Math.abs(y));
    }
}
