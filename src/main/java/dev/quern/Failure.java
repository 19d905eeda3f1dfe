package dev.quern;

/** The families of failure, each with the exit code the command line reports for it. */
public enum Failure {
    /** The command line itself was wrong. */
    USAGE(2),
    /** The recipe, or the recipe against the source's catalogue, is wrong. */
    RECIPE(65),
    /** The source cannot be reached or its data cannot be used as it is. */
    DATA(66),
    /**
     * The leakage audit found a blocking finding the recipe does not acknowledge: the build wrote the audit and
     * no matrix. (67 is sysexits' EX_NOUSER, unused by Quern otherwise; Quern gives it this meaning.)
     */
    LEAKAGE(67),
    /** An output could not be written. */
    OUTPUT(73),
    /** A fault of Quern's own. */
    INTERNAL(70);

    private final int exitCode;

    Failure(int exitCode) {
        this.exitCode = exitCode;
    }

    public int exitCode() {
        return exitCode;
    }
}
