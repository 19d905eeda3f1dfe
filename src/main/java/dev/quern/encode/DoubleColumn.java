package dev.quern.encode;

import java.util.Arrays;

/**
 * The values of one numeric column over the training rows, as a growing primitive array: 8 bytes a row.
 * Exact quantiles (bin edges, a median) need every value; a fit holds at most one such column at a time.
 */
final class DoubleColumn {

    private double[] values = new double[1024];
    private int size;

    void add(double x) {
        if (size == values.length) {
            if (values.length >= Integer.MAX_VALUE - 8) {
                throw new IllegalStateException("more training values than one array holds");
            }
            values = Arrays.copyOf(values, (int) Math.min(Integer.MAX_VALUE - 8L, values.length * 2L));
        }
        values[size++] = x;
    }

    int size() {
        return size;
    }

    /** The backing array; the first {@link #size()} values are the column's. */
    double[] array() {
        return values;
    }
}
