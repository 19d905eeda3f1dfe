package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.schema.ValueType;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The decimal column's texts found again: the very texts ValueFormat writes, whatever the column repeats. */
class DecimalTextsTest {

    private static final double[] AWKWARD = {0.0, -0.0, Double.NaN, Double.POSITIVE_INFINITY,
            Double.NEGATIVE_INFINITY, Double.MIN_VALUE, -Double.MAX_VALUE, 0.1, 0.30000000000000004, 1e21, 1e-7};

    @Test
    void aColumnOfFewValuesGetsTheSameTextsAndKeepsThem() {
        DecimalTexts texts = new DecimalTexts();
        SplittableRandom random = new SplittableRandom(11);
        String first = null;
        int repeats = 0;
        for (int i = 0; i < 50_000; i++) {
            // Amounts of a price list and their sums, with the odd awkward value among them.
            Double value = i % 97 == 0 ? AWKWARD[i / 97 % AWKWARD.length] : random.nextInt(300) * 0.05 + 4.99;
            String text = texts.text(value);
            assertEquals(ValueFormat.format(value, ValueType.DECIMAL), text, "for " + value);
            if (value.equals(7.49)) {
                if (first == null) {
                    first = text;
                } else {
                    assertSame(first, text, "a repeated value's text is the string written before");
                    repeats++;
                }
            }
        }
        assertTrue(repeats > 100, "7.49 came back " + repeats + " times");
    }

    @Test
    void aColumnOfEverNewValuesGetsTheSameTextsAfterItStopsLooking() {
        DecimalTexts texts = new DecimalTexts();
        SplittableRandom random = new SplittableRandom(12);
        String last = null;
        for (int i = 0; i < 50_000; i++) {
            Double value = i % 89 == 0 ? AWKWARD[i / 89 % AWKWARD.length] : random.nextDouble() * 1e6;
            String text = texts.text(value);
            assertEquals(ValueFormat.format(value, ValueType.DECIMAL), text, "for " + value);
            if (i == 49_998) {
                last = texts.text(value);
                assertNotSame(text, last, "past its trial, the column no longer keeps texts");
            }
        }
    }
}
