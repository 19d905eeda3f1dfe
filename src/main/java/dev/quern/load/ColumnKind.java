package dev.quern.load;

/** What a SQLite column's values are, found by reading them all, and so what it becomes in the target. */
public enum ColumnKind {
    /** Every value an integer. */
    INTEGER,
    /** Every value a number, at least one of them real. */
    DOUBLE,
    /** Text, or a mixture of text and numbers. */
    TEXT,
    /** Every value a valid {@code YYYY-MM-DD} text. */
    DATE,
    /** Every value a valid {@code YYYY-MM-DD HH:MM:SS} text ({@code T} or a fraction of a second allowed). */
    TIMESTAMP,
    /** Every value a blob. */
    BLOB
}
