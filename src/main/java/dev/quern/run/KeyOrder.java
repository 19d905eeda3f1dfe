package dev.quern.run;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.Comparator;

/**
 * The order engines sort values in, as far as keys and measures need it: numbers (by value, whole numbers
 * exactly) before text (by code point, the order of UTF-8 bytes that SQLite's and DuckDB's binary collation
 * use) before anything else. Streams ordered by the engine and merged in the JVM must agree on it.
 */
final class KeyOrder implements Comparator<Object> {

    static final KeyOrder INSTANCE = new KeyOrder();

    private KeyOrder() {
    }

    @Override
    public int compare(Object a, Object b) {
        // The pairs the merge and the ordered scan's max and min compare most, answered as below, sooner.
        if (a instanceof Long x && b instanceof Long y) {
            return Long.compare(x, y);
        }
        if (a instanceof Double x && b instanceof Double y) {
            return Double.compare(x + 0.0, y + 0.0);
        }
        int ra = rank(a);
        int rb = rank(b);
        if (ra != rb) {
            return Integer.compare(ra, rb);
        }
        if (a instanceof Number x && b instanceof Number y) {
            return numbers(x, y);
        }
        if (a instanceof String x && b instanceof String y) {
            return text(x, y);
        }
        if (a instanceof Comparable<?> && a.getClass() == b.getClass()) {
            @SuppressWarnings("unchecked")
            Comparable<Object> c = (Comparable<Object>) a;
            return c.compareTo(b);
        }
        return text(a.toString(), b.toString());
    }

    private static int rank(Object value) {
        if (value instanceof Number) {
            return 0;
        }
        return value instanceof String ? 1 : 2;
    }

    static boolean whole(Number n) {
        return n instanceof Long || n instanceof Integer || n instanceof Short || n instanceof Byte
                || n instanceof BigInteger;
    }

    private static int numbers(Number x, Number y) {
        if ((x instanceof Long || x instanceof Integer) && (y instanceof Long || y instanceof Integer)) {
            return Long.compare(x.longValue(), y.longValue());
        }
        if (whole(x) && whole(y) || x instanceof BigDecimal || y instanceof BigDecimal) {
            return decimal(x).compareTo(decimal(y));
        }
        return Double.compare(x.doubleValue() + 0.0, y.doubleValue() + 0.0);
    }

    private static BigDecimal decimal(Number n) {
        if (n instanceof BigDecimal d) {
            return d;
        }
        if (n instanceof BigInteger i) {
            return new BigDecimal(i);
        }
        if (whole(n)) {
            return BigDecimal.valueOf(n.longValue());
        }
        double d = n.doubleValue();
        return Double.isFinite(d) ? new BigDecimal(d) : BigDecimal.valueOf(Math.copySign(Double.MAX_VALUE, d));
    }

    /** By code point, which is the order of the UTF-8 bytes. */
    private static int text(String a, String b) {
        int i = 0;
        int j = 0;
        while (i < a.length() && j < b.length()) {
            int ca = a.codePointAt(i);
            int cb = b.codePointAt(j);
            if (ca != cb) {
                return Integer.compare(ca, cb);
            }
            i += Character.charCount(ca);
            j += Character.charCount(cb);
        }
        return Integer.compare(a.length() - i, b.length() - j);
    }
}
