package dev.quern.run;

import dev.quern.schema.ValueType;
import java.util.Optional;

/**
 * Running statistics of one output column, in constant memory: how many values are empty, and for
 * numbers the smallest, largest and mean (updated stably, as Welford did), for other values the smallest
 * and largest text. Unless made {@link #summaryOnly}, it also keeps a {@link ValueSketch} of the values
 * (level counts and a fixed-size sample), from which the report draws the column's chart.
 */
public final class ColumnStats {

    private final String column;
    private final ValueType type;
    private long rows;
    private long empty;
    private long numbers;
    private double mean;
    private double min = Double.POSITIVE_INFINITY;
    private double max = Double.NEGATIVE_INFINITY;
    private String minText;
    private String maxText;
    private final ValueSketch sketch;

    public ColumnStats(String column, ValueType type) {
        this(column, type, true);
    }

    private ColumnStats(String column, ValueType type, boolean sketched) {
        this.column = column;
        this.type = type;
        this.sketch = !sketched ? null : type.isNumber() ? ValueSketch.numbers() : ValueSketch.text();
    }

    /** Counts, extremes and mean without a sketch of the values: for per-cutoff tallies. */
    public static ColumnStats summaryOnly(String column, ValueType type) {
        return new ColumnStats(column, type, false);
    }

    /** Counts one cell: its value (null when empty) and the text written for it. */
    public void add(Object value, String text) {
        rows++;
        if (value == null) {
            empty++;
            return;
        }
        if (type.isNumber()) {
            // Most cells arrive as a Double or a Long: read them as they are, without boxing a new Double.
            if (value instanceof Double d) {
                addNumber(d, text);
            } else if (value instanceof Long n) {
                addNumber(n, text);
            } else {
                Double d = ValueFormat.number(value);
                if (d != null) {
                    addNumber(d, text);
                }
            }
        } else {
            if (sketch != null) {
                sketch.add(text);
            }
            if (minText == null || text.compareTo(minText) < 0) {
                minText = text;
            }
            if (maxText == null || text.compareTo(maxText) > 0) {
                maxText = text;
            }
        }
    }

    private void addNumber(double d, String text) {
        numbers++;
        mean += (d - mean) / numbers;
        min = Math.min(min, d);
        max = Math.max(max, d);
        if (sketch != null) {
            sketch.add(text, d);
        }
    }

    /** The sketch of the non-empty values; empty for a summary-only tally. */
    public Optional<ValueSketch> sketch() {
        return Optional.ofNullable(sketch);
    }

    /** Rows with a value (for numbers: with a value that reads as a number). */
    public long values() {
        return type.isNumber() ? numbers : rows - empty;
    }

    public String column() {
        return column;
    }

    public ValueType type() {
        return type;
    }

    public long rows() {
        return rows;
    }

    public long empty() {
        return empty;
    }

    /** Share of rows without a value, 0 for an empty matrix. */
    public double emptyShare() {
        return rows == 0 ? 0.0 : (double) empty / rows;
    }

    public Optional<String> min() {
        return type.isNumber() ? number(min) : Optional.ofNullable(minText);
    }

    public Optional<String> max() {
        return type.isNumber() ? number(max) : Optional.ofNullable(maxText);
    }

    public Optional<String> mean() {
        return type.isNumber() && numbers > 0 ? Optional.of(ValueFormat.format(mean, ValueType.DECIMAL))
                : Optional.empty();
    }

    private Optional<String> number(double v) {
        return numbers == 0 ? Optional.empty() : Optional.of(ValueFormat.format(v, type == ValueType.INTEGER
                ? ValueType.INTEGER : ValueType.DECIMAL));
    }
}
