package dev.quern.recipe;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/** The aggregates a feature block can compute over a window. */
public enum MeasureKind {
    COUNT("count", Input.NONE, "number of rows"),
    SUM("sum", Input.NUMBER, "sum of"),
    MEAN("mean", Input.NUMBER, "mean of"),
    MIN("min", Input.ORDERED, "smallest"),
    MAX("max", Input.ORDERED, "largest"),
    STDDEV("stddev", Input.NUMBER, "sample standard deviation of"),
    DISTINCT("distinct", Input.ANY, "number of distinct values of"),
    DAYS_SINCE_FIRST("days_since_first", Input.NONE, "whole days from the first row to the cutoff date"),
    DAYS_SINCE_LAST("days_since_last", Input.NONE, "whole days from the last row to the cutoff date");

    /** What kind of column a measure reads, if any. */
    public enum Input {
        NONE, NUMBER, ORDERED, ANY
    }

    private final String spelling;
    private final Input input;
    private final String phrase;

    MeasureKind(String spelling, Input input, String phrase) {
        this.spelling = spelling;
        this.input = input;
        this.phrase = phrase;
    }

    public String spelling() {
        return spelling;
    }

    public Input input() {
        return input;
    }

    public boolean takesColumn() {
        return input != Input.NONE;
    }

    /** A few words for the data dictionary. */
    public String phrase() {
        return phrase;
    }

    /** True where an empty window gives 0 rather than an empty value. */
    public boolean zeroWhenEmpty() {
        return this == COUNT || this == SUM || this == DISTINCT;
    }

    public static Optional<MeasureKind> ofSpelling(String s) {
        return Arrays.stream(values()).filter(k -> k.spelling.equals(s)).findFirst();
    }

    public static List<String> spellings() {
        return Arrays.stream(values()).map(MeasureKind::spelling).toList();
    }
}
