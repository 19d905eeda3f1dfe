package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.schema.ValueType;
import java.math.BigDecimal;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ValueFormatTest {

    /** The rule the matrix has always followed; the fast path must write exactly the same text. */
    private static String plain(double d) {
        return d == 0.0 ? "0" : BigDecimal.valueOf(d).stripTrailingZeros().toPlainString();
    }

    @Test
    void decimalsAreTheShortestPlainTextWithoutATrailingZero() {
        assertEquals("12", ValueFormat.format(12.0, ValueType.DECIMAL));
        assertEquals("100", ValueFormat.format(100.0, ValueType.DECIMAL));
        assertEquals("0.1", ValueFormat.format(0.1, ValueType.DECIMAL));
        assertEquals("-2.5", ValueFormat.format(-2.5, ValueType.DECIMAL));
        assertEquals("0", ValueFormat.format(-0.0, ValueType.DECIMAL));
        assertEquals("0.00012", ValueFormat.format(1.2e-4, ValueType.DECIMAL));
        assertEquals("0.0000001", ValueFormat.format(1e-7, ValueType.DECIMAL));
    }

    @Test
    void theFastPathWritesWhatBigDecimalWritesOverEveryMagnitude() {
        SplittableRandom random = new SplittableRandom(20261202);
        for (int i = 0; i < 200_000; i++) {
            double d = switch (i % 4) {
                case 0 -> random.nextDouble() * 1000;
                case 1 -> Math.round(random.nextDouble() * 1e6) / 100.0;
                case 2 -> (random.nextDouble() - 0.5) * Math.pow(10, random.nextInt(-12, 25));
                default -> Double.longBitsToDouble(random.nextLong());
            };
            if (Double.isFinite(d)) {
                assertEquals(plain(d), ValueFormat.format(d, ValueType.DECIMAL), "for " + d);
            }
        }
    }

    /** Small whole numbers come from a table made once; every whole number still reads as Long.toString writes it. */
    @Test
    void wholeNumbersAreTheirDecimalDigitsInsideAndOutsideTheTable() {
        for (long n = -5_000; n <= 10_000; n++) {
            assertEquals(Long.toString(n), ValueFormat.format(n, ValueType.INTEGER));
            assertEquals(Long.toString(n), ValueFormat.format((int) n, ValueType.INTEGER));
        }
        assertEquals("9223372036854775807", ValueFormat.format(Long.MAX_VALUE, ValueType.INTEGER));
        assertEquals("-9223372036854775808", ValueFormat.format(Long.MIN_VALUE, ValueType.INTEGER));
        assertEquals("42", ValueFormat.format(42.0, ValueType.INTEGER));
        assertEquals("42", ValueFormat.format(new BigDecimal("42.00"), ValueType.INTEGER));
    }
}
