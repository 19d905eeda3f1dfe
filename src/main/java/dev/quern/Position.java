package dev.quern;

import java.util.Objects;

/** Where a value came from: a file and a 1-based line and column. */
public record Position(String file, int line, int column) {

    /** For values that were not written by the user (defaults, generated names). */
    public static final Position NONE = new Position("", 0, 0);

    public Position {
        Objects.requireNonNull(file, "file");
    }

    /** The same file, moved right by {@code offset} columns: for places inside a string value. */
    public Position shifted(int offset) {
        return this == NONE ? NONE : new Position(file, line, column + offset);
    }

    public boolean isKnown() {
        return line > 0;
    }

    @Override
    public String toString() {
        if (!isKnown()) {
            return file;
        }
        return file + ":" + line + ":" + column;
    }
}
