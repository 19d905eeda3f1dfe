package dev.quern.run;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
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
 */
final class CutoffSpill implements AutoCloseable {

    private static final int BUFFER = 1 << 15;

    private enum Tag { NULL, LONG, DOUBLE, TEXT, DATE, TIMESTAMP, DECIMAL, TRUE, FALSE }

    private final Path folder;
    private final DataOutputStream[] files;
    private final int width;

    CutoffSpill(int cutoffs, int width) throws IOException {
        this.folder = Files.createTempDirectory("quern-spill-");
        this.files = new DataOutputStream[cutoffs];
        this.width = width;
    }

    void add(int cutoff, Object[] row) throws IOException {
        DataOutputStream out = files[cutoff];
        if (out == null) {
            out = new DataOutputStream(new BufferedOutputStream(Files.newOutputStream(file(cutoff)), BUFFER));
            files[cutoff] = out;
        }
        for (Object value : row) {
            write(out, value);
        }
    }

    /** Hands every row to {@code sink}, cutoff by cutoff, each cutoff's rows in the order they were added. */
    void replay(Consumer<Object[]> sink) throws IOException {
        for (int c = 0; c < files.length; c++) {
            if (files[c] == null) {
                continue;
            }
            files[c].close();
            try (DataInputStream in = new DataInputStream(new BufferedInputStream(Files.newInputStream(file(c)), BUFFER))) {
                while (true) {
                    Object[] row = new Object[width];
                    try {
                        row[0] = read(in);
                    } catch (EOFException end) {
                        break;
                    }
                    for (int i = 1; i < width; i++) {
                        row[i] = read(in);
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

    private static void write(DataOutputStream out, Object value) throws IOException {
        if (value == null) {
            out.writeByte(Tag.NULL.ordinal());
        } else if (value instanceof Long || value instanceof Integer || value instanceof Short || value instanceof Byte) {
            out.writeByte(Tag.LONG.ordinal());
            out.writeLong(((Number) value).longValue());
        } else if (value instanceof Double || value instanceof Float) {
            out.writeByte(Tag.DOUBLE.ordinal());
            out.writeDouble(((Number) value).doubleValue());
        } else if (value instanceof LocalDate d) {
            out.writeByte(Tag.DATE.ordinal());
            out.writeLong(d.toEpochDay());
        } else if (value instanceof LocalDateTime t) {
            out.writeByte(Tag.TIMESTAMP.ordinal());
            text(out, t.toString());
        } else if (value instanceof BigDecimal d) {
            out.writeByte(Tag.DECIMAL.ordinal());
            text(out, d.toString());
        } else if (value instanceof Boolean b) {
            out.writeByte((b ? Tag.TRUE : Tag.FALSE).ordinal());
        } else {
            // Every other type is written to the matrix as its text, so its text is all that needs keeping.
            out.writeByte(Tag.TEXT.ordinal());
            text(out, value.toString());
        }
    }

    private static Object read(DataInputStream in) throws IOException {
        int tag = in.readUnsignedByte();
        return switch (Tag.values()[tag]) {
            case NULL -> null;
            case LONG -> in.readLong();
            case DOUBLE -> in.readDouble();
            case TEXT -> readText(in);
            case DATE -> LocalDate.ofEpochDay(in.readLong());
            case TIMESTAMP -> LocalDateTime.parse(readText(in));
            case DECIMAL -> new BigDecimal(readText(in));
            case TRUE -> Boolean.TRUE;
            case FALSE -> Boolean.FALSE;
        };
    }

    private static void text(DataOutputStream out, String s) throws IOException {
        byte[] bytes = s.getBytes(StandardCharsets.UTF_8);
        out.writeInt(bytes.length);
        out.write(bytes);
    }

    private static String readText(DataInputStream in) throws IOException {
        byte[] bytes = new byte[in.readInt()];
        in.readFully(bytes);
        return new String(bytes, StandardCharsets.UTF_8);
    }

    @Override
    public void close() throws IOException {
        for (DataOutputStream out : files) {
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
