package dev.quern.audit;

import java.io.EOFException;
import java.io.IOException;
import java.io.Reader;

/**
 * Reads the matrix as {@code MatrixWriter} writes it (RFC 4180: fields separated by commas, records by LF or
 * CRLF, a field in double quotes may hold commas, line ends and doubled quotes) and keeps only the fields of
 * the columns asked for. The audit's passes each need a few of the matrix's columns; skipping the others
 * without making a String of each is what makes a pass over a wide matrix quick.
 *
 * <p>It reads only what Quern writes: text between a closing quote and the next delimiter is an error, as
 * it is for commons-csv, and a field is quoted only when its first character is the quote.
 */
final class CsvColumns implements AutoCloseable {

    private static final int BUFFER = 1 << 16;
    private static final int END = -1;

    private final Reader in;
    private final boolean[] wanted;
    private final String[] fields;
    private final char[] buffer = new char[BUFFER];
    private final StringBuilder field = new StringBuilder();
    private int at;
    private int end;
    private long record;

    /** A reader of {@code in} that keeps the fields of {@code columns} (0-based); the others are skipped. */
    CsvColumns(Reader in, int... columns) {
        this.in = in;
        int width = 0;
        for (int c : columns) {
            if (c < 0) {
                throw new IllegalArgumentException("no column " + c);
            }
            width = Math.max(width, c + 1);
        }
        this.wanted = new boolean[width];
        for (int c : columns) {
            wanted[c] = true;
        }
        this.fields = new String[width];
    }

    /**
     * Reads the next record; false at the end of the file. A record with too few fields for the columns
     * asked for is an error, not a row of empty values.
     */
    boolean next() throws IOException {
        if (at == end && !fill()) {
            return false;
        }
        record++;
        int column = 0;
        int stop;
        do {
            boolean keep = column < wanted.length && wanted[column];
            field.setLength(0);
            stop = (at < end || fill()) && buffer[at] == '"' ? quoted(keep) : plain(keep);
            if (keep) {
                fields[column] = field.toString();
            }
            column++;
        } while (stop == ',');
        if (column < wanted.length) {
            throw new IOException("record " + record + " has " + column + " fields, fewer than the "
                    + wanted.length + " needed");
        }
        return true;
    }

    /** The field of {@code column} in the current record; the column must be one asked for. */
    String get(int column) {
        if (column >= wanted.length || !wanted[column]) {
            throw new IllegalArgumentException("column " + column + " was not asked for");
        }
        return fields[column];
    }

    /** An unquoted field, up to the delimiter or line end, which it returns (END at the file's end). */
    private int plain(boolean keep) throws IOException {
        while (at < end || fill()) {
            int from = at;
            while (at < end) {
                char c = buffer[at];
                if (c == ',' || c == '\n' || c == '\r') {
                    break;
                }
                at++;
            }
            if (keep) {
                field.append(buffer, from, at - from);
            }
            if (at < end) {
                return terminator(buffer[at++]);
            }
        }
        return END;
    }

    /** A quoted field from its opening quote, with doubled quotes made single; returns what follows it. */
    private int quoted(boolean keep) throws IOException {
        at++;
        while (true) {
            if (at == end && !fill()) {
                throw new EOFException("the file ends inside a quoted field of record " + record);
            }
            int from = at;
            while (at < end && buffer[at] != '"') {
                at++;
            }
            if (keep) {
                field.append(buffer, from, at - from);
            }
            if (at == end) {
                continue;
            }
            at++;
            if (at == end && !fill()) {
                return END;
            }
            char c = buffer[at++];
            if (c == '"') {
                if (keep) {
                    field.append('"');
                }
            } else if (c == ',' || c == '\n' || c == '\r') {
                return terminator(c);
            } else {
                throw new IOException("invalid character after a quoted field of record " + record);
            }
        }
    }

    /** What ended a field: the delimiter, or a line end (a CR takes the LF after it along). */
    private int terminator(char c) throws IOException {
        if (c == '\r' && (at < end || fill()) && buffer[at] == '\n') {
            at++;
        }
        return c == ',' ? ',' : '\n';
    }

    private boolean fill() throws IOException {
        int read = in.read(buffer, 0, buffer.length);
        at = 0;
        end = Math.max(read, 0);
        return read > 0;
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
