package dev.quern.sql;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/**
 * How a block's windows are computed. Every shape gives the same matrix; they differ in what the engine
 * does well, which the benchmark measures (see {@link ShapeChooser} for the choice per engine).
 */
public enum BlockShape {
    /**
     * The cohort joined to the path's rows on key and time range, grouped by (key, cutoff), each window a
     * conditional aggregate: what engines with fast hash joins and range filters do well.
     */
    RANGE_JOIN,
    /**
     * One scan of the path's rows ordered by key and day; the windows of every cutoff are computed in the
     * JVM while one entity's rows at a time are held. Each row is read once instead of once per cutoff.
     */
    ORDERED_SCAN;

    /** {@code range-join}, {@code ordered-scan}: how the command line spells it. */
    public String spelling() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    public static Optional<BlockShape> ofSpelling(String text) {
        return Arrays.stream(values()).filter(s -> s.spelling().equals(text)).findFirst();
    }
}
