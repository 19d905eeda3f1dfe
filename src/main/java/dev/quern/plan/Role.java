package dev.quern.plan;

/** What an output column is for. */
public enum Role {
    KEY("key"),
    CUTOFF("cutoff"),
    FEATURE("feature"),
    /** Which part of a time split (train, validation, test) the row is in: for the modeller, not the model. */
    SPLIT("split"),
    LABEL("label");

    private final String label;

    Role(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }
}
