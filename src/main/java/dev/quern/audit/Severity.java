package dev.quern.audit;

/** How much a finding matters: a blocking finding stops the build unless the recipe acknowledges it. */
public enum Severity {
    /** The matrix may see past its cutoff: no matrix is written unless the recipe acknowledges it. */
    BLOCKING("blocking"),
    /** Suspicious or likely to leak; reported, the build goes on. */
    WARNING("warning"),
    /** Worth knowing; nothing is wrong. */
    NOTE("note");

    private final String label;

    Severity(String label) {
        this.label = label;
    }

    public String label() {
        return label;
    }
}
