package dev.quern.run;

import java.math.BigInteger;

/**
 * The shortest decimal that reads back as a given double, and of those the closest to it (the even digit on a
 * tie), written plainly: no exponent, no trailing zeros after the point. Java 19 and later print these digits
 * in {@code Double.toString}; Java 17's {@code Double.toString} sometimes prints a digit more, or a last
 * digit farther from the double (JDK-4511638), so a matrix would differ between runtimes; it is also about a
 * third slower (a microbenchmark of values like a matrix's). This is R. Giulietti's Schubfach algorithm
 * ("The Schubfach way to render doubles", 2020, section 9 and the figures with its Java code), on 126-bit
 * powers of ten computed with {@link BigInteger} as each is first needed: a matrix needs a few dozen of the
 * 617, and computing them all took 30 to 50 ms of every build.
 */
final class ShortestDecimal {

    /** Significand bits of a double (the hidden bit not counted), and the smallest exponent of its lowest bit. */
    private static final int P = 53;
    private static final int Q_MIN = -1074;
    private static final long C_MIN = 1L << (P - 1);
    private static final long T_MASK = C_MIN - 1;
    /** Subnormal significands below this have too few digits for the algorithm: they are scaled by ten first. */
    private static final long C_TINY = 3;

    /** The range of k = floor(log10(2^q)) over all doubles, and g = floor(10^-k 2^-r) + 1 per k, once known. */
    private static final int K_MIN = -324;
    private static final int K_MAX = 292;
    private static final Power[] POWERS = new Power[K_MAX - K_MIN + 1];

    private static final long MASK_63 = (1L << 63) - 1;
    private static final BigInteger LOW_63 = BigInteger.ONE.shiftLeft(63).subtract(BigInteger.ONE);

    /**
     * g's upper and lower 63 bits. Final fields: a thread that finds another's power in the table sees both.
     * Two threads may compute the same power; they store equal values.
     */
    private record Power(long g1, long g0) {
    }

    private ShortestDecimal() {
    }

    /** {@code v}, finite and not zero, as its shortest decimal in plain notation. */
    static String plain(double v) {
        long bits = Double.doubleToRawLongBits(v);
        boolean negative = bits < 0;
        long t = bits & T_MASK;
        int bq = (int) (bits >>> (P - 1)) & 0x7FF;
        if (bq == 0x7FF || (bq == 0 && t == 0)) {
            throw new IllegalArgumentException("not a finite non-zero number: " + v);
        }
        if (bq != 0) {
            int mq = -Q_MIN + 1 - bq;
            long c = C_MIN | t;
            // A whole number below 2^53 is its own shortest decimal.
            if (0 < mq && mq < P) {
                long f = c >> mq;
                if (f << mq == c) {
                    return render(negative, f, 0);
                }
            }
            return toDecimal(negative, -mq, c, 0);
        }
        return t < C_TINY ? toDecimal(negative, Q_MIN, 10 * t, -1) : toDecimal(negative, Q_MIN, t, 0);
    }

    /** The value c 2^q: its rounding interval scaled by 10^-k, and the shortest decimal inside it. */
    private static String toDecimal(boolean negative, int q, long c, int dk) {
        int out = (int) c & 1;
        long cb = c << 2;
        long cbr = cb + 2;
        long cbl;
        int k;
        // At a power of two the interval below is half as wide as above.
        if (c != C_MIN || q == Q_MIN) {
            cbl = cb - 2;
            k = flog10pow2(q);
        } else {
            cbl = cb - 1;
            k = flog10threeQuartersPow2(q);
        }
        int h = q + flog2pow10(-k) + 2;
        Power g = POWERS[k - K_MIN];
        if (g == null) {
            g = power(k);
            POWERS[k - K_MIN] = g;
        }
        long g1 = g.g1();
        long g0 = g.g0();
        long vb = rop(g1, g0, cb << h);
        long vbl = rop(g1, g0, cbl << h);
        long vbr = rop(g1, g0, cbr << h);
        long s = vb >> 2;
        if (s >= 100) {
            // One digit fewer, when a multiple of ten lies in the interval.
            long sp10 = 10 * Math.multiplyHigh(s, 115_292_150_460_684_698L << 4);
            long tp10 = sp10 + 10;
            boolean upin = vbl + out <= sp10 << 2;
            boolean wpin = (tp10 << 2) + out <= vbr;
            if (upin != wpin) {
                return render(negative, upin ? sp10 : tp10, k);
            }
        }
        long u = s + 1;
        boolean uin = vbl + out <= s << 2;
        boolean win = (u << 2) + out <= vbr;
        if (uin != win) {
            return render(negative, uin ? s : u, k + dk);
        }
        long cmp = vb - (s + u << 1);
        return render(negative, cmp < 0 || cmp == 0 && (s & 1) == 0 ? s : u, k + dk);
    }

    /** Rounds (g1 2^63 + g0) cp / 2^127 to odd: the bit that says "inexact" is kept in the lowest place. */
    private static long rop(long g1, long g0, long cp) {
        long x1 = Math.multiplyHigh(g0, cp);
        long y0 = g1 * cp;
        long y1 = Math.multiplyHigh(g1, cp);
        long z = (y0 >>> 1) + x1;
        long vbp = y1 + (z >>> 63);
        return vbp | (z & MASK_63) + MASK_63 >>> 63;
    }

    /**
     * f 10^e in plain notation, without trailing zeros: the characters are placed in one array from the last
     * digit back, two digits at a time, cheaper than building the text from a {@code Long.toString}.
     */
    private static String render(boolean negative, long f, int e) {
        while (f % 10 == 0) {
            f /= 10;
            e++;
        }
        int n = digits(f);
        int sign = negative ? 1 : 0;
        byte[] text;
        if (e >= 0) {
            // A whole number: the digits, then e zeros.
            text = new byte[sign + n + e];
            java.util.Arrays.fill(text, sign + n, text.length, (byte) '0');
            digits(text, sign + n, f, n);
        } else if (n > -e) {
            // The point among the digits: the -e after it, the point, those before it.
            int fraction = -e;
            text = new byte[sign + n + 1];
            long whole = digits(text, text.length, f, fraction);
            text[sign + n - fraction] = '.';
            digits(text, sign + n - fraction, whole, n - fraction);
        } else {
            // Below one: "0.", the zeros that lead the fraction, then the digits.
            text = new byte[sign + 2 - e];
            java.util.Arrays.fill(text, sign, text.length - n, (byte) '0');
            text[sign + 1] = '.';
            digits(text, text.length, f, n);
        }
        if (negative) {
            text[0] = '-';
        }
        return new String(text, java.nio.charset.StandardCharsets.ISO_8859_1);
    }

    /**
     * Writes the last {@code count} digits of {@code v}, zeros first where it has fewer, to end just before
     * {@code end}; returns the digits before them, {@code v / 10^count}.
     */
    private static long digits(byte[] text, int end, long v, int count) {
        int at = end;
        for (; count >= 2; count -= 2) {
            int pair = (int) (v % 100);
            v /= 100;
            text[--at] = PAIRS[2 * pair + 1];
            text[--at] = PAIRS[2 * pair];
        }
        if (count == 1) {
            text[--at] = (byte) ('0' + v % 10);
            v /= 10;
        }
        return v;
    }

    /** "00" to "99", each pair of characters at twice its value. */
    private static final byte[] PAIRS = new byte[200];
    /** 10^0 to 10^18: every power of ten a long holds. */
    private static final long[] POWERS_OF_TEN = new long[19];

    static {
        for (int i = 0; i < 100; i++) {
            PAIRS[2 * i] = (byte) ('0' + i / 10);
            PAIRS[2 * i + 1] = (byte) ('0' + i % 10);
        }
        POWERS_OF_TEN[0] = 1;
        for (int i = 1; i < POWERS_OF_TEN.length; i++) {
            POWERS_OF_TEN[i] = POWERS_OF_TEN[i - 1] * 10;
        }
    }

    /** The number of decimal digits of {@code f}, which is positive. */
    private static int digits(long f) {
        // log10(2) is about 1233 / 4096: the bit length gives the count or one more than it.
        int n = (64 - Long.numberOfLeadingZeros(f)) * 1233 >>> 12;
        return n < POWERS_OF_TEN.length && f >= POWERS_OF_TEN[n] ? n + 1 : Math.max(n, 1);
    }

    /** floor(q log10 2), for |q| up to 5456721. */
    private static int flog10pow2(int q) {
        return (int) (q * 661_971_961_083L >> 41);
    }

    /** floor(log10(3/4 2^q)), for |q| up to 2^16. */
    private static int flog10threeQuartersPow2(int q) {
        return (int) (q * 661_971_961_083L + -274_743_187_321L >> 41);
    }

    /** floor(e log2 10), for |e| up to 1233. */
    private static int flog2pow10(int e) {
        return (int) (e * 913_124_641_741L >> 38);
    }

    /** g = floor(10^-k 2^-r) + 1 with r = floor(log2 10^-k) - 125, so that 2^125 < g < 2^126. */
    private static Power power(int k) {
        int r = flog2pow10(-k) - 125;
        // 10^-k 2^-r as a fraction num / den of whole numbers.
        BigInteger num = BigInteger.ONE;
        BigInteger den = BigInteger.ONE;
        if (k <= 0) {
            num = BigInteger.TEN.pow(-k);
        } else {
            den = BigInteger.TEN.pow(k);
        }
        if (r <= 0) {
            num = num.shiftLeft(-r);
        } else {
            den = den.shiftLeft(r);
        }
        BigInteger g = num.divide(den).add(BigInteger.ONE);
        return new Power(g.shiftRight(63).longValueExact(), g.and(LOW_63).longValue());
    }
}
