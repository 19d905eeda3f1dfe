package dev.quern.expr;

import dev.quern.schema.ValueType;
import java.util.Optional;

/**
 * The types the checker reasons with: the schema's value types that expressions can use, plus the type of
 * a bare {@code null}, which fits anywhere until its context settles it.
 */
enum ExprType {
    INTEGER("a number"),
    DECIMAL("a number"),
    TEXT("text"),
    BOOLEAN("a boolean"),
    DATE("a date"),
    TIMESTAMP("a timestamp"),
    NULL("null");

    private final String noun;

    ExprType(String noun) {
        this.noun = noun;
    }

    /** How a message names a value of this type: "duration is text", "joined_on is a date". */
    String noun() {
        return noun;
    }

    boolean isNumber() {
        return this == INTEGER || this == DECIMAL;
    }

    boolean isTemporal() {
        return this == DATE || this == TIMESTAMP;
    }

    /** Columns of type OTHER (blobs, arrays, intervals) have no meaning in an expression. */
    static Optional<ExprType> of(ValueType type) {
        return switch (type) {
            case INTEGER -> Optional.of(INTEGER);
            case DECIMAL -> Optional.of(DECIMAL);
            case TEXT -> Optional.of(TEXT);
            case BOOLEAN -> Optional.of(BOOLEAN);
            case DATE -> Optional.of(DATE);
            case TIMESTAMP -> Optional.of(TIMESTAMP);
            case OTHER -> Optional.empty();
        };
    }

    ValueType valueType() {
        return switch (this) {
            case INTEGER -> ValueType.INTEGER;
            case DECIMAL -> ValueType.DECIMAL;
            case TEXT -> ValueType.TEXT;
            case BOOLEAN -> ValueType.BOOLEAN;
            case DATE -> ValueType.DATE;
            case TIMESTAMP -> ValueType.TIMESTAMP;
            case NULL -> ValueType.OTHER;
        };
    }

    /**
     * Whether a comparison between the two makes sense: numbers with numbers, dates and timestamps with
     * each other (a date stands for its whole day), and null with anything.
     */
    boolean comparableWith(ExprType other) {
        if (this == NULL || other == NULL) {
            return true;
        }
        return this == other || (isNumber() && other.isNumber()) || (isTemporal() && other.isTemporal());
    }

    /**
     * The one type that values of both types can share as the result of coalesce, least, greatest or
     * nullif: whole and decimal numbers share decimal; a date and a timestamp do not mix, because the result
     * would be a date on some rows and a timestamp on others.
     */
    static Optional<ExprType> common(ExprType a, ExprType b) {
        if (a == NULL) {
            return Optional.of(b);
        }
        if (b == NULL || a == b) {
            return Optional.of(a);
        }
        if (a.isNumber() && b.isNumber()) {
            return Optional.of(DECIMAL);
        }
        return Optional.empty();
    }
}
