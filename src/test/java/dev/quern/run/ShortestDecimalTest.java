package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The digits of a double, held to the rule of the Java SE 19 specification of {@code Double.toString(double)}
 * (Giulietti's Schubfach; JDK-4511638): of the decimals that round to the double, those of the least length
 * (lengths 1 and 2 together when the least is 1), and of those the closest, the even last digit on a tie.
 * The reference below finds that decimal slowly with {@link BigDecimal}; {@link ShortestDecimal} must find the
 * same, written plainly.
 */
class ShortestDecimalTest {

    @Test
    void awkwardValuesMatchTheRuleOfTheSpecification() {
        double[] values = {1, -1, 0.1, 0.2, 0.1 + 0.2, 1.0 / 3, 2.0 / 3, 100, 1e7, 1e-3, 9.999999999999999e22, 1e23,
            2e23, 8.41e21, 5e-324, Double.MIN_VALUE, Double.MIN_NORMAL, Double.MAX_VALUE, -Double.MAX_VALUE,
            4.9e-324, 1.0e-322, 2.2250738585072014E-308, 2.225073858507201E-308, 1.7976931348623157e308,
            123456789012345678.0, 9007199254740992.0, 9007199254740993.0, 4503599627370496.5, 0.5, 0.25, 0.125,
            1e15, 1e16, 1e17, 1e-5, 1.5e-7, 2.82879384806159E17, 1.18575755E-316, 2.0E-3, 2.9802322387695312E-8,
            Math.PI, Math.E, 12.5, 60.0, 3.14e-10, 1e300, 1e-300, 7.0e-10, 8.0e-10};
        for (double v : values) {
            assertEquals(reference(v), ShortestDecimal.plain(v), "value " + v);
        }
    }

    @Test
    void everyPowerOfTwoMatchesTheRule() {
        // At a power of two the rounding interval is lopsided, a case of its own in the algorithm.
        for (int e = -1074; e <= 1023; e++) {
            double v = Math.scalb(1.0, e);
            assertEquals(reference(v), ShortestDecimal.plain(v), "2^" + e);
        }
    }

    @Test
    void randomDoublesMatchTheRule() {
        SplittableRandom random = new SplittableRandom(20261203);
        for (int i = 0; i < 100_000; i++) {
            // Any bit pattern: every exponent, subnormals included.
            double v = Double.longBitsToDouble(random.nextLong());
            if (Double.isFinite(v) && v != 0) {
                assertEquals(reference(v), ShortestDecimal.plain(v), "bits " + Long.toHexString(Double.doubleToRawLongBits(v)));
            }
        }
    }

    @Test
    void matrixLikeNumbersMatchTheRule() {
        // Sums, means and deviations of amounts and distances: a few decimals, a few thousand at most.
        SplittableRandom random = new SplittableRandom(7);
        for (int i = 0; i < 100_000; i++) {
            double v = switch (i % 4) {
                case 0 -> Math.round(random.nextDouble(0, 5000) * 100) / 100.0;
                case 1 -> random.nextDouble(0, 5000) / random.nextInt(1, 400);
                case 2 -> Math.sqrt(random.nextDouble(0, 1e4));
                default -> Math.round(random.nextDouble(0, 100) * 10) / 10.0 + Math.round(random.nextDouble(0, 100) * 10) / 10.0;
            };
            if (v != 0) {
                assertEquals(reference(v), ShortestDecimal.plain(v), "value " + v);
            }
        }
    }

    @Test
    void whereJava17PrintsMoreDigitsTheTextIsShorterAndReadsBackTheSame() {
        // JDK-4511638: Java 17's Double.toString gives 2.82879384806159008E17 for this double.
        double v = 2.82879384806159E17;
        String text = ShortestDecimal.plain(v);
        assertEquals("282879384806159000", text);
        assertEquals(v, Double.parseDouble(text));
    }

    @Test
    void onlyFiniteNonZeroNumbersHaveDigits() {
        assertThrows(IllegalArgumentException.class, () -> ShortestDecimal.plain(0.0));
        assertThrows(IllegalArgumentException.class, () -> ShortestDecimal.plain(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> ShortestDecimal.plain(Double.NEGATIVE_INFINITY));
    }

    /** The decimal the specification chooses, found by trying every length from one digit up. */
    private static String reference(double v) {
        BigDecimal exact = new BigDecimal(v);
        for (int length = 1; length <= 17; length++) {
            List<BigDecimal> candidates = readingBack(v, exact, length);
            if (candidates.isEmpty()) {
                continue;
            }
            if (length == 1) {
                candidates.addAll(readingBack(v, exact, 2));
            }
            BigDecimal best = null;
            for (BigDecimal c : candidates) {
                if (best == null) {
                    best = c;
                    continue;
                }
                int closer = c.subtract(exact).abs().compareTo(best.subtract(exact).abs());
                if (closer < 0 || closer == 0 && c.compareTo(best) != 0 && lastDigitEven(c)) {
                    best = c;
                }
            }
            assertTrue(best.signum() != 0);
            return best.stripTrailingZeros().toPlainString();
        }
        throw new AssertionError("no decimal of 17 digits reads back as " + v);
    }

    /** The decimals of {@code length} digits just below and above {@code exact} that read back as {@code v}. */
    private static List<BigDecimal> readingBack(double v, BigDecimal exact, int length) {
        List<BigDecimal> out = new ArrayList<>();
        for (RoundingMode mode : new RoundingMode[] {RoundingMode.DOWN, RoundingMode.UP}) {
            BigDecimal c = exact.round(new MathContext(length, mode));
            if (Double.parseDouble(c.toString()) == v && out.stream().noneMatch(o -> o.compareTo(c) == 0)) {
                out.add(c);
            }
        }
        return out;
    }

    private static boolean lastDigitEven(BigDecimal d) {
        return d.stripTrailingZeros().unscaledValue().testBit(0) == false;
    }
}
