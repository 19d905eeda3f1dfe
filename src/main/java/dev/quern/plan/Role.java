package dev.quern.plan;

/** What an output column is for. */
public enum Role {
    KEY("key"),
    CUTOFF("cutoff"),
    FEATURE("feature"),
    LABEL("label");

    private final String label;

    Role(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }
}
