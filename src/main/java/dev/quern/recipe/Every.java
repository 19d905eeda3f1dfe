package dev.quern.recipe;

/** The regular cutoff schedules. */
public enum Every {
    /** The last day of each calendar month. */
    MONTH_END("month-end"),
    /** Each Sunday (ISO weeks end on Sunday). */
    WEEK_END("week-end");

    private final String spelling;

    Every(String spelling) {
        this.spelling = spelling;
    }

    public String spelling() {
        return spelling;
    }
}
