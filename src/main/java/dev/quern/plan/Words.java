package dev.quern.plan;

import dev.quern.recipe.Span;

/** Plain-language pieces for the data dictionary. */
final class Words {

    private Words() {
    }

    /** {@code 30d} reads "30 days", {@code 6m} "6 calendar months". */
    static String span(Span span) {
        int n = span.amount();
        String unit = switch (span.unit()) {
            case DAY -> n == 1 ? "day" : "days";
            case WEEK -> n == 1 ? "week" : "weeks";
            case MONTH -> n == 1 ? "calendar month" : "calendar months";
            case YEAR -> n == 1 ? "calendar year" : "calendar years";
        };
        return n + " " + unit;
    }

    static String window(Span window) {
        return "in the " + span(window) + " up to the end of the cutoff day";
    }

    static String path(EventPath path) {
        if (path.hops().isEmpty()) {
            return path.table();
        }
        StringBuilder out = new StringBuilder(path.table());
        for (Hop hop : path.hops()) {
            out.append(" (through ").append(hop.link().column()).append(" to ").append(hop.table()).append(')');
        }
        return out.toString();
    }
}
