package dev.quern.recipe;

/** The unit of a window, gap or horizon length. */
public enum WindowUnit {
    DAY('d'),
    WEEK('w'),
    /** Calendar months: stepped back from the cutoff's day boundary, so 1m after a month end is a whole month. */
    MONTH('m'),
    /** Calendar years, stepped like months. */
    YEAR('y');

    private final char suffix;

    WindowUnit(char suffix) {
        this.suffix = suffix;
    }

    public char suffix() {
        return suffix;
    }

    public static WindowUnit ofSuffix(char c) {
        for (WindowUnit u : values()) {
            if (u.suffix == c) {
                return u;
            }
        }
        throw new IllegalArgumentException("no window unit '" + c + "'");
    }
}
