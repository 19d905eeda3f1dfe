package dev.quern.expr;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/** The language's fixed list of functions, with how many arguments each takes. */
enum BuiltIn {
    ABS(1, 1),
    ROUND(1, 2),
    LN(1, 1),
    LOG10(1, 1),
    EXP(1, 1),
    SQRT(1, 1),
    // At least two: SQLite's coalesce() refuses one argument, and its min()/max() with one are aggregates.
    COALESCE(2, Integer.MAX_VALUE),
    NULLIF(2, 2),
    LEAST(2, Integer.MAX_VALUE),
    GREATEST(2, Integer.MAX_VALUE),
    LOWER(1, 1),
    UPPER(1, 1),
    LENGTH(1, 1),
    YEAR(1, 1),
    MONTH(1, 1),
    DAY_OF_WEEK(1, 1),
    HOUR(1, 1),
    DAYS_BETWEEN(2, 2);

    private final int fewest;
    private final int most;

    BuiltIn(int fewest, int most) {
        this.fewest = fewest;
        this.most = most;
    }

    /** The name as written in an expression: {@code day_of_week}. */
    String written() {
        return name().toLowerCase(Locale.ROOT);
    }

    static Optional<BuiltIn> named(String lowered) {
        return Arrays.stream(values()).filter(f -> f.written().equals(lowered)).findFirst();
    }

    static List<String> names() {
        return Arrays.stream(values()).map(BuiltIn::written).toList();
    }

    boolean accepts(int arguments) {
        return arguments >= fewest && arguments <= most;
    }

    /** "abs takes 1 argument", "round takes 1 or 2 arguments", "coalesce takes at least 2 arguments". */
    String arity() {
        String count;
        if (most == Integer.MAX_VALUE) {
            count = "at least " + fewest + " arguments";
        } else if (fewest == most) {
            count = fewest + (fewest == 1 ? " argument" : " arguments");
        } else {
            count = fewest + " or " + most + " arguments";
        }
        return written() + " takes " + count;
    }
}
