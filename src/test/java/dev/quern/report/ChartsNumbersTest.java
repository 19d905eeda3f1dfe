package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The charts write their numbers without {@link String#format}, and must write the very bytes it writes, so a
 * report is the same whichever way it was made. The reference is the JDK's own {@code java.util.Formatter}
 * (the {@code %.Nf} and {@code %,d} conversions with {@code Locale.ROOT}).
 */
class ChartsNumbersTest {

    private static final double[] AWKWARD = {0, -0.0, 0.005, 0.015, 0.025, 0.125, 0.375, 1.005, 2.675, -0.005,
        -0.001, -0.004999, 0.004999, 0.5, 1.5, 2.5, -2.5, 99.995, 99.994999, 100, 1e-7, -1e-7, 123456789.125,
        1e15 + 0.3, 4.35, 8.345, 1.45, 0.05, 0.95, 9.95, 99.95, 320, 38.5, 276.000001, Double.MIN_VALUE,
        -Double.MIN_VALUE, 1.0 / 3, 2.0 / 3, 12.345, 0.285, 1.115};

    @Test
    void fixedDecimalsAreTheFormattersOwn() {
        for (double v : AWKWARD) {
            for (int places = 1; places <= 2; places++) {
                assertEquals(String.format(Locale.ROOT, "%." + places + "f", v), Charts.fixed(v, places),
                        v + " to " + places + " places");
            }
        }
        SplittableRandom random = new SplittableRandom(7);
        for (int i = 0; i < 200_000; i++) {
            // Coordinates and shares: a few hundred at most, many ending in a 5 at the third decimal.
            double v = i % 2 == 0 ? random.nextDouble(-400, 400) : Math.round(random.nextDouble(-400, 400) * 1000) / 1000.0;
            assertEquals(String.format(Locale.ROOT, "%.2f", v), Charts.fixed(v, 2), "value " + v);
            assertEquals(String.format(Locale.ROOT, "%.1f", v), Charts.fixed(v, 1), "value " + v);
        }
    }

    @Test
    void coordinatesLoseTrailingZerosAndNegativeZero() {
        assertEquals("12.5", Charts.f(12.5));
        assertEquals("12", Charts.f(12.001));
        assertEquals("100", Charts.f(100));
        assertEquals("0", Charts.f(-0.001));
        assertEquals("0", Charts.f(-0.0));
        assertEquals("-0.01", Charts.f(-0.005));
        assertEquals("0.3", Charts.f(0.3));
    }

    @Test
    void countsAndPercentsAreTheFormattersOwn() {
        long[] counts = {0, 7, -7, 999, 1000, -1000, 12345, 999_999, 1_000_000, -1_234_567, 273_013, Long.MAX_VALUE,
            Long.MIN_VALUE};
        for (long n : counts) {
            assertEquals(String.format(Locale.ROOT, "%,d", n), Charts.count(n), "count " + n);
        }
        SplittableRandom random = new SplittableRandom(11);
        for (int i = 0; i < 100_000; i++) {
            long n = random.nextLong() >> random.nextInt(64);
            assertEquals(String.format(Locale.ROOT, "%,d", n), Charts.count(n), "count " + n);
            double share = random.nextDouble();
            assertEquals(String.format(Locale.ROOT, "%.1f%%", 100 * share), Charts.percent(share), "share " + share);
        }
    }
}
