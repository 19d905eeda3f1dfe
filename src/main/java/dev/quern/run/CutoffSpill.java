package dev.quern.run;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.math.BigDecimal;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.Comparator;
import java.util.function.Consumer;
import java.util.stream.Stream;

/**
 * Rows that arrive in key order, kept on disk in one file per cutoff and read back cutoff by cutoff: the
 * matrix's order (cutoff, then key) from a merge that runs in (key, cutoff) order, with memory that does
 * not grow with the row count. Values keep their Java type through the file.
 *
 * <p>Each cell is a tag byte and, for numbers and dates, 8 big-endian bytes; text is its UTF-8 length and
 * bytes. The cells are packed into a plain byte array per file and moved to and from the disk in large
 * chunks: a stream call per cell was most of the cost of a spill of hundreds of thousands of rows. A text
 * that repeats its column's previous one is a single byte, read back as the same String, which is neither
 * decoded again nor hashed again by the statistics downstream.
 */
final class CutoffSpill implements AutoCloseable {

    /** Bytes held per cutoff file while writing, and while reading the one file being read. */
    private static final int BUFFER = 1 << 16;
    /**
     * Bytes held by all the files being written: daily cutoffs over years are a thousand files, whose
     * buffers must stay small beside a heap of a few hundred megabytes.
     */
    private static final int WRITE_BUFFERS = 16 << 20;
    private static final int SMALLEST_BUFFER = 1 << 12;

    /** Reads and writes a long at any offset of a byte array, big-endian, without a stream. */
    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.BIG_ENDIAN);
    private static final VarHandle INTS = MethodHandles.byteArrayViewVarHandle(int[].class, ByteOrder.BIG_ENDIAN);

    private static final byte NULL = 0;
    private static final byte LONG = 1;
    private static final byte DOUBLE = 2;
    private static final byte TEXT = 3;
    private static final byte DATE = 4;
    private static final byte TIMESTAMP = 5;
    private static final byte DECIMAL = 6;
    private static final byte TRUE = 7;
    private static final byte FALSE = 8;
    /** Text equal to the previous text of its column in the same file: the cutoff, in every row of its file. */
    private static final byte SAME_TEXT = 9;

    private final Path folder;
    private final Spool[] files;
    private final int width;
    private final int writeBuffer;

    CutoffSpill(int cutoffs, int width) throws IOException {
        this.folder = Files.createTempDirectory("quern-spill-");
        this.files = new Spool[cutoffs];
        this.width = width;
        this.writeBuffer = Math.max(SMALLEST_BUFFER, Math.min(BUFFER, WRITE_BUFFERS / Math.max(1, cutoffs)));
    }

    void add(int cutoff, Object[] row) throws IOException {
        Spool out = files[cutoff];
        if (out == null) {
            out = new Spool(Files.newOutputStream(file(cutoff)), width, writeBuffer);
            files[cutoff] = out;
        }
        for (int i = 0; i < row.length; i++) {
            out.write(i, row[i]);
        }
    }

    /**
     * Hands every row to {@code sink}, cutoff by cutoff, each cutoff's rows in the order they were added.
     * The row array is reused for the next row: the sink reads it and keeps none of it but its values.
     */
    void replay(Consumer<Object[]> sink) throws IOException {
        Object[] row = new Object[width];
        for (int c = 0; c < files.length; c++) {
            if (files[c] == null) {
                continue;
            }
            files[c].close();
            files[c] = null;
            try (Unspool in = new Unspool(Files.newInputStream(file(c)), width)) {
                while (in.more()) {
                    for (int i = 0; i < width; i++) {
                        row[i] = in.read(i);
                    }
                    sink.accept(row);
                }
            }
            Files.delete(file(c));
        }
    }

    private Path file(int cutoff) {
        return folder.resolve(cutoff + ".rows");
    }

    /** One cutoff's file being written: cells packed into a buffer that goes to the stream when full. */
    private static final class Spool implements AutoCloseable {
        private final OutputStream out;
        private final byte[] buffer;
        private final String[] lastText;
        private int at;

        Spool(OutputStream out, int width, int bufferBytes) {
            this.out = out;
            this.buffer = new byte[bufferBytes];
            this.lastText = new String[width];
        }

        void write(int column, Object value) throws IOException {
            room(9);
            if (value == null) {
                buffer[at++] = NULL;
            } else if (value instanceof Long || value instanceof Integer || value instanceof Short
                    || value instanceof Byte) {
                tagged(LONG, ((Number) value).longValue());
            } else if (value instanceof Double || value instanceof Float) {
                tagged(DOUBLE, Double.doubleToRawLongBits(((Number) value).doubleValue()));
            } else if (value instanceof LocalDate d) {
                tagged(DATE, d.toEpochDay());
            } else if (value instanceof LocalDateTime t) {
                text(TIMESTAMP, t.toString());
            } else if (value instanceof BigDecimal d) {
                text(DECIMAL, d.toString());
            } else if (value instanceof Boolean b) {
                buffer[at++] = b ? TRUE : FALSE;
            } else {
                // Every other type is written to the matrix as its text, so its text is all that needs keeping.
                String text = value.toString();
                if (text.equals(lastText[column])) {
                    buffer[at++] = SAME_TEXT;
                } else {
                    lastText[column] = text;
                    text(TEXT, text);
                }
            }
        }

        private void tagged(byte tag, long bits) {
            buffer[at] = tag;
            LONGS.set(buffer, at + 1, bits);
            at += 9;
        }

        private void text(byte tag, String s) throws IOException {
            byte[] bytes = s.getBytes(StandardCharsets.UTF_8);
            buffer[at] = tag;
            INTS.set(buffer, at + 1, bytes.length);
            at += 5;
            if (bytes.length > buffer.length - at) {
                drain();
                out.write(bytes);
            } else {
                System.arraycopy(bytes, 0, buffer, at, bytes.length);
                at += bytes.length;
            }
        }

        private void room(int bytes) throws IOException {
            if (buffer.length - at < bytes) {
                drain();
            }
        }

        private void drain() throws IOException {
            out.write(buffer, 0, at);
            at = 0;
        }

        @Override
        public void close() throws IOException {
            try (out) {
                drain();
            }
        }
    }

    /** One cutoff's file being read back, a buffer at a time. */
    private static final class Unspool implements AutoCloseable {
        private final InputStream in;
        private final byte[] buffer = new byte[BUFFER];
        private final String[] lastText;
        private int at;
        private int end;

        Unspool(InputStream in, int width) {
            this.in = in;
            this.lastText = new String[width];
        }

        /** True while another row follows: rows are whole, so any byte left starts one. */
        boolean more() throws IOException {
            return at < end || fill(1);
        }

        Object read(int column) throws IOException {
            need(1);
            byte tag = buffer[at++];
            return switch (tag) {
                case NULL -> null;
                case LONG -> readLong();
                case DOUBLE -> Double.longBitsToDouble(readLong());
                case TEXT -> lastText[column] = readText();
                case SAME_TEXT -> lastText[column];
                case DATE -> LocalDate.ofEpochDay(readLong());
                case TIMESTAMP -> LocalDateTime.parse(readText());
                case DECIMAL -> new BigDecimal(readText());
                case TRUE -> Boolean.TRUE;
                case FALSE -> Boolean.FALSE;
                default -> throw new IllegalStateException("the spill file has a cell of unknown tag " + tag);
            };
        }

        private long readLong() throws IOException {
            need(8);
            long v = (long) LONGS.get(buffer, at);
            at += 8;
            return v;
        }

        private String readText() throws IOException {
            need(4);
            int length = (int) INTS.get(buffer, at);
            at += 4;
            if (length <= buffer.length) {
                need(length);
                String s = new String(buffer, at, length, StandardCharsets.UTF_8);
                at += length;
                return s;
            }
            // Longer than the buffer: what is buffered, then the rest straight from the file.
            byte[] bytes = new byte[length];
            int buffered = end - at;
            System.arraycopy(buffer, at, bytes, 0, buffered);
            at = end;
            if (in.readNBytes(bytes, buffered, length - buffered) != length - buffered) {
                throw new EOFException("the spill file ends inside a text value");
            }
            return new String(bytes, StandardCharsets.UTF_8);
        }

        private void need(int bytes) throws IOException {
            if (end - at < bytes && !fill(bytes)) {
                throw new EOFException("the spill file ends inside a row");
            }
        }

        /** Moves what is left to the front and reads until {@code bytes} are buffered; false at the file's end. */
        private boolean fill(int bytes) throws IOException {
            System.arraycopy(buffer, at, buffer, 0, end - at);
            end -= at;
            at = 0;
            while (end < bytes) {
                int read = in.read(buffer, end, buffer.length - end);
                if (read < 0) {
                    return false;
                }
                end += read;
            }
            return true;
        }

        @Override
        public void close() throws IOException {
            in.close();
        }
    }

    @Override
    public void close() throws IOException {
        for (Spool out : files) {
            if (out != null) {
                try {
                    out.close();
                } catch (IOException e) {
                    // Closing what is about to be deleted.
                }
            }
        }
        try (Stream<Path> left = Files.walk(folder)) {
            left.sorted(Comparator.reverseOrder()).forEach(p -> {
                try {
                    Files.deleteIfExists(p);
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            });
        }
    }
}
