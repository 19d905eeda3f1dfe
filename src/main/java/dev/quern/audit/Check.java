package dev.quern.audit;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * The checks of the leakage audit. Each id is short and stable: it is what {@code audit.json} reports and
 * what a recipe names when it acknowledges a finding ({@code audit: { acknowledge: [ { check: current-state,
 * column: home_zone, reason: ... } ] }}).
 */
public enum Check {
    TIME_ORDER("time-order", "every source row that fed a row is dated on or before its cutoff"),
    HORIZON("horizon", "the label horizon starts after the cutoff and no window or lookup reaches into it"),
    CURRENT_STATE("current-state", "no feature reads a table that keeps no time or history"),
    LATE_UPDATE("late-update", "no row that fed a feature was updated after the cutoff"),
    FILLED_LATER("filled-later", "no value that fed a feature was filled in after the cutoff"),
    SINGLE_FEATURE("single-feature", "no column alone predicts the label almost perfectly"),
    COHORT("cohort", "every row's entity existed at its cutoff, and no entity appears twice at one cutoff"),
    TIME_SPLIT("time-split", "no training label is observed in a later part of the split"),
    SENSITIVE("sensitive", "columns about protected attributes of people are named, and keys never become features");

    private final String id;
    private final String title;

    Check(String id, String title) {
        this.id = id;
        this.title = title;
    }

    /** The stable id: {@code time-order}, {@code current-state}, ... */
    public String id() {
        return id;
    }

    /** What the check makes sure of, in one line. */
    public String title() {
        return title;
    }

    public static Optional<Check> byId(String id) {
        return Arrays.stream(values()).filter(c -> c.id.equals(id)).findFirst();
    }

    public static List<String> ids() {
        return Arrays.stream(values()).map(Check::id).toList();
    }
}
