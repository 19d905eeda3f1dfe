package dev.quern.run;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * Writes records, in UTF-8, with the very bytes a {@code CSVPrinter} over {@link MatrixWriter#FORMAT} writes,
 * faster for the plain values a matrix is mostly made of: numbers, dates, codes and empty cells.
 *
 * <p>commons-csv quotes a value, with the format's minimal quoting, when it is empty and first in its record,
 * starts with a character at or below {@code '#'}, ends with one at or below {@code ' '}, or holds a quote,
 * the delimiter, CR or LF anywhere ({@code CSVFormat.printWithQuotes}, 1.14.1). A value made only of
 * {@link #plain plain} characters, with no space at either end, meets none of these and is written as it
 * is; an empty value after the first is just its delimiter. Every other value goes to {@code FORMAT.print}
 * itself, so an unusual value costs time, never a different byte. {@code CsvRecordsTest} holds the two
 * writers to the same bytes.
 *
 * <p>The plain characters are ASCII, so a plain value's characters are its UTF-8 bytes, copied as they are.
 * A {@code Writer} would widen them to {@code char}s and encode them back one by one: that was most of the
 * time taken writing a matrix of a million rows.
 */
final class CsvRecords {

    /** Bytes buffered before they go to the stream: one call per many records, not one per cell. */
    private static final int CHUNK = 1 << 16;

    /** The plain characters, by code: a table, as every character of nearly every cell is looked up. */
    private static final boolean[] PLAIN = new boolean[128];

    static {
        for (char c : "0123456789abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ.-+_:/ ".toCharArray()) {
            PLAIN[c] = true;
        }
    }

    private final OutputStream out;
    private byte[] buffer = new byte[CHUNK + 1024];
    private int size;
    /** Where commons-csv writes a value that needs quotes, before its UTF-8 bytes join the buffer. */
    private final StringBuilder quoted = new StringBuilder();

    CsvRecords(OutputStream out) {
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
                append((byte) ',');
            } else if (numbers != null && numbers[i] || plain(value)) {
                if (!first) {
                    append((byte) ',');
                }
                appendAscii(value);
            } else {
                quoted.setLength(0);
                MatrixWriter.FORMAT.print(value, quoted, first);
                append(quoted.toString().getBytes(StandardCharsets.UTF_8));
            }
        }
        append((byte) '\n');
        if (size >= CHUNK) {
            drain();
        }
    }

    /** Hands everything buffered to the stream and flushes it. */
    void flush() throws IOException {
        drain();
        out.flush();
    }

    private void drain() throws IOException {
        out.write(buffer, 0, size);
        size = 0;
    }

    private void append(byte b) {
        room(1);
        buffer[size++] = b;
    }

    private void append(byte[] bytes) {
        room(bytes.length);
        System.arraycopy(bytes, 0, buffer, size, bytes.length);
        size += bytes.length;
    }

    /** A text of ASCII characters only, whose low bytes are its UTF-8. */
    @SuppressWarnings("deprecation")
    private void appendAscii(String s) {
        int n = s.length();
        room(n);
        // The one String method that copies characters to bytes without an encoder: it keeps each char's low
        // byte, which is the character itself for ASCII.
        s.getBytes(0, n, buffer, size);
        size += n;
    }

    private void room(int bytes) {
        if (buffer.length - size < bytes) {
            buffer = Arrays.copyOf(buffer, Math.max(buffer.length * 2, size + bytes));
        }
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
