package dev.quern.schema;

/** The kinds of value Quern distinguishes, whatever the engine calls them. */
public enum ValueType {
    INTEGER("integer"),
    DECIMAL("decimal"),
    TEXT("text"),
    DATE("date"),
    TIMESTAMP("timestamp"),
    BOOLEAN("boolean"),
    OTHER("other");

    private final String label;

    ValueType(String label) {
        this.label = label;
    }

    /** The word used in the data dictionary. */
    public String label() {
        return label;
    }

    public boolean isNumber() {
        return this == INTEGER || this == DECIMAL;
    }

    public boolean isTemporal() {
        return this == DATE || this == TIMESTAMP;
    }
}
