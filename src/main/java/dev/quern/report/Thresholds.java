package dev.quern.report;

/**
 * How much change between two builds is acceptable before {@code quern compare} says stop.
 *
 * @param maxPsi             largest acceptable PSI of a column (default 0.25: above it reads as a large shift)
 * @param maxEmptyChange     largest acceptable change of a column's share of empty values (default 0.10)
 * @param maxRowChange       largest acceptable relative change of the rows at a cutoff both builds have
 *                           (default 0.10)
 * @param allowColumnChanges when false (the default), a column removed or retyped is a finding; added
 *                           columns never are
 */
public record Thresholds(double maxPsi, double maxEmptyChange, double maxRowChange, boolean allowColumnChanges) {

    public static final Thresholds DEFAULT = new Thresholds(Psi.Reading.LARGE_ABOVE, 0.10, 0.10, false);

    public Thresholds {
        check("maxPsi", maxPsi);
        check("maxEmptyChange", maxEmptyChange);
        check("maxRowChange", maxRowChange);
    }

    private static void check(String name, double value) {
        if (!(value >= 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException(name + " must be a number of 0 or more: " + value);
        }
    }
}
