package dev.quern.run;

import dev.quern.schema.ValueType;

/**
 * The texts of a decimal column's recent values, found by the value's bits. A column of amounts, or of their
 * sums and means over a month, repeats a few hundred values, and each would otherwise be written out anew
 * for every row and then, as a new string, hashed anew by the column's level counts; a text found here is
 * the same string, whose hash is kept. A column whose values seldom repeat stops looking after a trial.
 */
final class DecimalTexts {

    private static final int SLOT_BITS = 9;
    /** Values looked up before the column is judged, and the share of them that must have been found. */
    private static final int TRIAL = 8_192;
    private static final int FOUND_AT_LEAST = TRIAL / 4;

    private long[] bits = new long[1 << SLOT_BITS];
    private String[] texts = new String[1 << SLOT_BITS];
    private int looked;
    private int found;

    /** The text {@link ValueFormat} writes for {@code value} in a decimal column. */
    String text(Double value) {
        if (texts == null) {
            return ValueFormat.format(value, ValueType.DECIMAL);
        }
        long key = Double.doubleToRawLongBits(value);
        // The high bits of the key times 2^64 over the golden ratio depend on all of its bits.
        int slot = (int) ((key * 0x9E3779B97F4A7C15L) >>> (Long.SIZE - SLOT_BITS));
        String text = texts[slot];
        boolean hit = text != null && bits[slot] == key;
        if (!hit) {
            text = ValueFormat.format(value, ValueType.DECIMAL);
            bits[slot] = key;
            texts[slot] = text;
        }
        if (looked < TRIAL) {
            found += hit ? 1 : 0;
            if (++looked == TRIAL && found < FOUND_AT_LEAST) {
                bits = null;
                texts = null;
            }
        }
        return text;
    }
}
