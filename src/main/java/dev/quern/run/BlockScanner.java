package dev.quern.run;

import dev.quern.QuernException;
import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import dev.quern.plan.Boundary;
import dev.quern.plan.ColumnRef;
import dev.quern.sql.BlockScan;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;

/**
 * Reads one ordered-scan block's rows, one entity at a time, and answers each (entity, cutoff) of the
 * matrix with the block's measures. The entities come in key order, as the matrix rows do, so only the
 * current entity's rows are held: memory grows with the longest history of one entity, not with the table.
 */
final class BlockScanner implements AutoCloseable {

    private final BlockScan scan;
    private final ResultSet rows;
    private final int[] types;
    private final String dayColumn;
    private final List<Aggregate> aggregates;
    private final int inputs;
    private final int[] aggregateInput;
    /** Each input's source column when it is a number column, else null: its values must then be numbers. */
    private final ColumnRef[] numberInput;
    private final java.util.Map<LocalDate, Bounds> boundaries = new java.util.HashMap<>();
    /** Each aggregate's first row at the current cutoff, refilled by every {@link #measure} call. */
    private final int[] from;
    private static final Object[] NONE = new Object[0];
    /** One per input, for the totals its windows share; the last for the measures that take no input. */
    private final Measures[] measures;

    /** The current entity: its key and its rows' days (also as epoch days) and inputs, in day order. */
    private Object key;
    private int size;
    private int[] days = new int[64];
    private long[] epochDays = new long[64];
    private Object[][] values;
    /** The inputs of number columns as doubles (0 where the value is null), for the measures that add them. */
    private double[][] numbers;

    /** The next entity's first row, read ahead; {@code exhausted} once the result has no more rows. */
    private boolean pending;
    private boolean exhausted;

    BlockScanner(BlockScan scan, ResultSet rows, int[] types) {
        this.scan = scan;
        this.rows = rows;
        this.types = types.clone();
        Block block = scan.block();
        this.dayColumn = block.path().time().column().qualified();
        this.aggregates = block.aggregates();
        this.from = new int[aggregates.size()];
        this.inputs = types.length - (BlockScan.FIRST_INPUT - 1);
        this.values = new Object[inputs][64];
        this.numbers = new double[inputs][];
        this.measures = new Measures[inputs + 1];
        for (int i = 0; i <= inputs; i++) {
            measures[i] = new Measures();
        }
        this.aggregateInput = new int[aggregates.size()];
        this.numberInput = new ColumnRef[inputs];
        for (int i = 0; i < aggregates.size(); i++) {
            aggregateInput[i] = scan.inputColumn(i) - BlockScan.FIRST_INPUT;
            ColumnRef input = aggregates.get(i).input().orElse(null);
            if (aggregateInput[i] >= 0 && input != null && input.type().isNumber()) {
                numberInput[aggregateInput[i]] = input;
                numbers[aggregateInput[i]] = new double[64];
            }
        }
    }

    Block block() {
        return scan.block();
    }

    /**
     * Puts the block's measures for {@code entity} at {@code cutoff} into {@code out}, one per aggregate in
     * block order starting at {@code offsets}' positions. Entities must be asked for in key order.
     */
    void measure(Object entity, LocalDate cutoff, Object[] out, int[] offsets) throws SQLException {
        advanceTo(entity);
        boolean has = key != null && KeyOrder.INSTANCE.compare(key, entity) == 0;
        Bounds bounds = boundaries.get(cutoff);
        if (bounds == null) {
            bounds = boundaries(cutoff);
            boundaries.put(cutoff, bounds);
        }
        int to = has ? lowerBound(bounds.end()) : 0;
        // A block's aggregates share a few windows: each distinct start day is looked up once.
        for (int i = 0; i < from.length; i++) {
            int same = bounds.sameStartAs()[i];
            from[i] = !has ? 0 : same < i ? from[same] : lowerBound(bounds.starts()[i]);
        }
        for (Measures m : measures) {
            m.forget();
        }
        for (int i = 0; i < aggregates.size(); i++) {
            Aggregate a = aggregates.get(i);
            int first = from[i];
            int at = aggregateInput[i];
            out[offsets[i]] = at >= 0
                    ? measures[at].of(a.kind(), values[at], numbers[at], epochDays, first, Math.max(first, to),
                            bounds.cutoff(), a.column())
                    : measures[inputs].of(a.kind(), NONE, null, epochDays, first, Math.max(first, to), bounds.cutoff(),
                            a.column());
        }
    }

    /**
     * The windows at one cutoff, as {@link Days} numbers: each aggregate's start day, the first aggregate
     * with the same start (itself if none comes before it), and the end of the cutoff day; and the cutoff's
     * epoch day, for the days since a row.
     */
    private record Bounds(int[] starts, int[] sameStartAs, int end, long cutoff) {
    }

    private Bounds boundaries(LocalDate cutoff) {
        int[] starts = new int[aggregates.size()];
        int[] same = new int[aggregates.size()];
        for (int i = 0; i < aggregates.size(); i++) {
            starts[i] = Days.of(new Boundary.WindowStart(aggregates.get(i).window()).at(cutoff));
            same[i] = i;
            for (int j = 0; j < i; j++) {
                if (starts[j] == starts[i]) {
                    same[i] = j;
                    break;
                }
            }
        }
        return new Bounds(starts, same, Days.of(new Boundary.CutoffEnd().at(cutoff)), cutoff.toEpochDay());
    }

    /** A stream the engine ordered otherwise than the merge expects: the range join does not depend on order. */
    static QuernException outOfOrder(String what, Object previous, Object next) {
        return QuernException.data(what + " came back with key " + next + " after " + previous + ", not in the"
                + " order the ordered scan merges by (numbers, then text by code point); build with --shape range-join");
    }

    /** Reads entities until the current one is {@code entity} or after it. */
    private void advanceTo(Object entity) throws SQLException {
        while (key == null || KeyOrder.INSTANCE.compare(key, entity) < 0) {
            if (!readEntity()) {
                key = null;
                return;
            }
        }
    }

    /** Loads the next entity's rows; false at the end of the result. */
    private boolean readEntity() throws SQLException {
        if (!pending && (exhausted || !next())) {
            return false;
        }
        Object previous = key;
        key = ValueFormat.read(rows, 1, types[0]);
        if (previous != null && KeyOrder.INSTANCE.compare(previous, key) >= 0) {
            throw outOfOrder("the scan of " + scan.block().path().text(), previous, key);
        }
        size = 0;
        boolean sorted = true;
        do {
            append();
            sorted &= size < 2 || days[size - 2] <= days[size - 1];
            pending = next();
        } while (pending && KeyOrder.INSTANCE.compare(ValueFormat.read(rows, 1, types[0]), key) == 0);
        if (!sorted) {
            sortByDay();
        }
        return true;
    }

    private boolean next() throws SQLException {
        boolean more = rows.next();
        exhausted = !more;
        return more;
    }

    private void append() throws SQLException {
        if (size == days.length) {
            int grown = size * 2;
            days = Arrays.copyOf(days, grown);
            epochDays = Arrays.copyOf(epochDays, grown);
            for (int i = 0; i < inputs; i++) {
                values[i] = Arrays.copyOf(values[i], grown);
                if (numbers[i] != null) {
                    numbers[i] = Arrays.copyOf(numbers[i], grown);
                }
            }
        }
        days[size] = Days.of(ValueFormat.read(rows, 2, types[1]), dayColumn);
        epochDays[size] = Days.epochDay(days[size]);
        for (int i = 0; i < inputs; i++) {
            Object value = ValueFormat.read(rows, BlockScan.FIRST_INPUT + i, types[BlockScan.FIRST_INPUT - 1 + i]);
            if (value != null && numberInput[i] != null && !(value instanceof Number)) {
                throw notANumber(numberInput[i], value, days[size]);
            }
            values[i][size] = value;
            if (numbers[i] != null) {
                numbers[i][size] = value == null ? 0.0 : ((Number) value).doubleValue();
            }
        }
        size++;
    }

    /** SQLite keeps whatever is put in a column, so a number column can hold text; no measure can use it. */
    private QuernException notANumber(ColumnRef column, Object value, int day) {
        return QuernException.data(column.qualified() + " holds " + ValueFormat.quoted(value) + " in a row of "
                + scan.block().path().entityLink().qualified() + " " + key + " dated "
                + String.format("%04d-%02d-%02d", day / 10_000, day / 100 % 100, day % 100)
                + ", where a number belongs (SQLite keeps whatever is put in a column): "
                + ValueFormat.TEXT_IN_NUMBERS_CURE);
    }

    /** Engines order the days as {@link Days} does; this only guards against one that does not. */
    private void sortByDay() {
        Integer[] order = new Integer[size];
        for (int i = 0; i < size; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Integer.compare(days[a], days[b]));
        int[] d = new int[days.length];
        long[] e = new long[days.length];
        Object[][] v = new Object[inputs][days.length];
        double[][] n = new double[inputs][];
        for (int j = 0; j < inputs; j++) {
            n[j] = numbers[j] == null ? null : new double[days.length];
        }
        for (int i = 0; i < size; i++) {
            d[i] = days[order[i]];
            e[i] = epochDays[order[i]];
            for (int j = 0; j < inputs; j++) {
                v[j][i] = values[j][order[i]];
                if (n[j] != null) {
                    n[j][i] = numbers[j][order[i]];
                }
            }
        }
        days = d;
        epochDays = e;
        values = v;
        numbers = n;
    }

    /** The first held row whose day is on or after {@code day}. */
    private int lowerBound(int day) {
        int lo = 0;
        int hi = size;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (days[mid] < day) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    @Override
    public void close() throws SQLException {
        rows.close();
    }
}
