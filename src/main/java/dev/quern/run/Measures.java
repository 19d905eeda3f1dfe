package dev.quern.run;

import dev.quern.QuernException;
import dev.quern.recipe.MeasureKind;
import java.math.BigDecimal;
import java.util.HashSet;
import java.util.Set;

/**
 * The measures of the ordered scan over one window's rows of one entity, by the same rules as the SQL of
 * the range join: empty values are skipped, an empty window gives 0 for count, sum and distinct and no value
 * otherwise, and a standard deviation needs two values.
 */
final class Measures {

    /**
     * The compensated totals already taken over windows of the current (entity, cutoff): the mean and the
     * standard deviation of a window share one, which the second would otherwise take again.
     */
    private final long[] memoWindow = new long[8];
    private final Total[] memo = new Total[8];
    private int memoSize;

    /** Forgets the totals taken: the next measures are of another input, entity or cutoff. */
    void forget() {
        memoSize = 0;
    }

    /**
     * {@code kind} over rows {@code [from, to)}: {@code values} are the input of each row (null for count
     * and the day measures), {@code numbers} the same values as doubles where they are numbers (null when the
     * input is not a number column), {@code days} their {@link Days#epochDay epoch days}, and {@code cutoff}
     * the cutoff's.
     */
    Object of(MeasureKind kind, Object[] values, double[] numbers, long[] days, int from, int to, long cutoff,
              String column) {
        return switch (kind) {
            case COUNT -> (long) (to - from);
            case SUM -> sum(values, numbers, from, to, column);
            case MEAN -> mean(total(values, numbers, from, to));
            case MIN -> extreme(values, from, to, -1);
            case MAX -> extreme(values, from, to, 1);
            case DISTINCT -> distinct(values, from, to);
            case STDDEV -> stddev(values, numbers, from, to);
            case DAYS_SINCE_FIRST -> to > from ? since(days[from], cutoff) : null;
            case DAYS_SINCE_LAST -> to > from ? since(days[to - 1], cutoff) : null;
        };
    }

    /** Row {@code i}'s input, present and a number, as a double: read once per row where the scan keeps them. */
    private static double number(Object[] values, double[] numbers, int i) {
        return numbers != null ? numbers[i] : ((Number) values[i]).doubleValue();
    }

    /** Whole days from {@code day} to {@code cutoff}; empty for a day of a month that does not exist. */
    private static Long since(long day, long cutoff) {
        return day == Days.NO_DAY ? null : cutoff - day;
    }

    /**
     * Whole numbers add exactly, as every engine's sum of integers does; decimals from a DECIMAL column
     * exactly as well; any floating value makes it a compensated floating sum, as SQLite's sum() is.
     */
    private static Object sum(Object[] values, double[] numbers, int from, int to, String column) {
        long whole = 0;
        BigDecimal exact = null;
        CompensatedSum floating = null;
        for (int i = from; i < to; i++) {
            Object v = values[i];
            if (v == null) {
                continue;
            }
            if (floating != null) {
                floating.add(number(values, numbers, i));
            } else if (v instanceof Double || v instanceof Float) {
                floating = new CompensatedSum();
                floating.add(exact == null ? whole : exact.doubleValue());
                floating.add(((Number) v).doubleValue());
            } else if (v instanceof BigDecimal || v instanceof java.math.BigInteger || exact != null) {
                exact = (exact == null ? BigDecimal.valueOf(whole) : exact).add(decimal((Number) v));
            } else {
                try {
                    whole = Math.addExact(whole, ((Number) v).longValue());
                } catch (ArithmeticException e) {
                    throw QuernException.data("the sum of " + column + " goes beyond the range of whole numbers", e);
                }
            }
        }
        if (floating != null) {
            return floating.value();
        }
        return exact != null ? exact : (Object) whole;
    }

    private static Object mean(Total total) {
        return total.n == 0 ? null : total.sum / total.n;
    }

    /** The compensated sum of the values present, and how many there are. */
    private record Total(double sum, long n) {
    }

    private Total total(Object[] values, double[] numbers, int from, int to) {
        long window = (long) from << 32 | to;
        for (int i = 0; i < memoSize; i++) {
            if (memoWindow[i] == window) {
                return memo[i];
            }
        }
        CompensatedSum sum = new CompensatedSum();
        long n = 0;
        for (int i = from; i < to; i++) {
            if (values[i] != null) {
                sum.add(number(values, numbers, i));
                n++;
            }
        }
        Total total = new Total(sum.value(), n);
        if (memoSize < memo.length) {
            memoWindow[memoSize] = window;
            memo[memoSize++] = total;
        }
        return total;
    }

    /** The sample standard deviation in two passes (deviations from the mean), which NIST's hard cases need. */
    private Object stddev(Object[] values, double[] numbers, int from, int to) {
        Total total = total(values, numbers, from, to);
        long n = total.n;
        if (n < 2) {
            return null;
        }
        double mean = total.sum / n;
        CompensatedSum squares = new CompensatedSum();
        for (int i = from; i < to; i++) {
            if (values[i] != null) {
                double d = number(values, numbers, i) - mean;
                squares.add(d * d);
            }
        }
        return Math.sqrt(squares.value() / (n - 1));
    }

    private static Object extreme(Object[] values, int from, int to, int sign) {
        Object best = null;
        for (int i = from; i < to; i++) {
            Object v = values[i];
            if (v != null && (best == null || sign * KeyOrder.INSTANCE.compare(v, best) > 0)) {
                best = v;
            }
        }
        return best;
    }

    /** Equal numbers are one value whatever their type (1 and 1.0), as in SQL. */
    private static Object distinct(Object[] values, int from, int to) {
        Set<Object> seen = new HashSet<>();
        for (int i = from; i < to; i++) {
            Object v = values[i];
            if (v != null) {
                seen.add(v instanceof Number n ? decimal(n).stripTrailingZeros() : v);
            }
        }
        return (long) seen.size();
    }

    private static BigDecimal decimal(Number n) {
        if (n instanceof BigDecimal d) {
            return d;
        }
        if (n instanceof java.math.BigInteger i) {
            return new BigDecimal(i);
        }
        if (KeyOrder.whole(n)) {
            return BigDecimal.valueOf(n.longValue());
        }
        double d = n.doubleValue();
        return Double.isFinite(d) ? BigDecimal.valueOf(d) : BigDecimal.valueOf(Math.copySign(Double.MAX_VALUE, d));
    }

    /** Neumaier's compensated summation, the algorithm SQLite's sum() and avg() use since 3.43. */
    static final class CompensatedSum {
        private double sum;
        private double compensation;

        void add(double x) {
            double t = sum + x;
            if (Math.abs(sum) >= Math.abs(x)) {
                compensation += (sum - t) + x;
            } else {
                compensation += (x - t) + sum;
            }
            sum = t;
        }

        double value() {
            return sum + compensation;
        }
    }
}
