package dev.quern.schema;

/**
 * How a time column keeps its values. Quern's window boundaries are all day boundaries, so ISO text
 * compares correctly against {@code YYYY-MM-DD} literals whatever follows the date (a space, a {@code T}).
 */
public enum TimeStorage {
    /** Text that starts with {@code YYYY-MM-DD}: SQLite's usual form. */
    ISO_TEXT,
    /** A DATE column of an engine that has one. */
    NATIVE_DATE,
    /** A TIMESTAMP column of an engine that has one. */
    NATIVE_TIMESTAMP
}
