package dev.quern.run;

import java.io.IOException;
import java.io.Writer;

/**
 * Writes records with the very bytes a {@code CSVPrinter} over {@link MatrixWriter#FORMAT} writes, faster for
 * the plain values a matrix is mostly made of: numbers, dates, codes and empty cells.
 *
 * <p>commons-csv quotes a value, with the format's minimal quoting, when it is empty and first in its record,
 * starts with a character at or below {@code '#'}, ends with one at or below {@code ' '}, or holds a quote,
 * the delimiter, CR or LF anywhere ({@code CSVFormat.printWithQuotes}, 1.14.1). A value made only of
 * {@link #plain plain} characters, with no space at either end, meets none of these and is written as it
 * is; an empty value after the first is just its delimiter. Every other value goes to {@code FORMAT.print}
 * itself, so an unusual value costs time, never a different byte. {@code CsvRecordsTest} holds the two
 * writers to the same bytes.
 */
final class CsvRecords {

    /** Characters buffered before they go to the writer: one call per many records, not one per cell. */
    private static final int CHUNK = 1 << 16;

    /** The plain characters, by code: a table, as every character of nearly every cell is looked up. */
    private static final boolean[] PLAIN = new boolean[128];

    static {
        for (char c : "0123456789abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ.-+_:/ ".toCharArray()) {
            PLAIN[c] = true;
        }
    }

    private final Writer out;
    private final StringBuilder buffer = new StringBuilder(CHUNK + 1024);

    CsvRecords(Writer out) {
        this.out = out;
    }

    /** Writes one record and its '\n' separator; a null is left to commons-csv, which never quotes it. */
    void write(String... values) throws IOException {
        write(values, null);
    }

    /**
     * Writes one record as {@link #write(String...)} does, where {@code numbers}, when given, marks the values
     * known to be a number's text: digits, a sign and a point, or NaN and Infinity, never empty. Those are
     * plain without a look at their characters.
     */
    void write(String[] values, boolean[] numbers) throws IOException {
        for (int i = 0; i < values.length; i++) {
            String value = values[i];
            boolean first = i == 0;
            if (value != null && value.isEmpty() && !first) {
                buffer.append(',');
            } else if (numbers != null && numbers[i] || plain(value)) {
                if (!first) {
                    buffer.append(',');
                }
                buffer.append(value);
            } else {
                MatrixWriter.FORMAT.print(value, buffer, first);
            }
        }
        buffer.append('\n');
        if (buffer.length() >= CHUNK) {
            drain();
        }
    }

    /** Hands everything buffered to the writer and flushes it. */
    void flush() throws IOException {
        drain();
        out.flush();
    }

    private void drain() throws IOException {
        out.append(buffer);
        buffer.setLength(0);
    }

    /**
     * True for a non-empty value of ASCII letters, digits and {@code . - + _ : /}, with spaces only inside
     * it: every such character is above {@code '#'}, and none is a quote, delimiter or line end.
     */
    static boolean plain(String value) {
        int n = value == null ? 0 : value.length();
        if (n == 0 || value.charAt(0) == ' ' || value.charAt(n - 1) == ' ') {
            return false;
        }
        for (int i = 0; i < n; i++) {
            char c = value.charAt(i);
            if (c >= PLAIN.length || !PLAIN[c]) {
                return false;
            }
        }
        return true;
    }
}
