package dev.quern.audit;

import static dev.quern.audit.Results.columns;
import static dev.quern.audit.Results.count;
import static dev.quern.audit.Results.list;

import dev.quern.Position;
import dev.quern.audit.SourceRows.Counted;
import dev.quern.audit.SourceRows.Question;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.TableSpec;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The checks about the source rows behind the features: time order, current-state tables, late updates and
 * values filled in later. The counts come from {@link SourceRows}; this class decides what they mean.
 */
final class SourceChecks {

    private final Recipe recipe;
    private final Plan plan;
    private final List<Counted> counted;
    private final Results results;

    SourceChecks(Recipe recipe, Plan plan, List<Counted> counted, Results results) {
        this.recipe = recipe;
        this.plan = plan;
        this.counted = List.copyOf(counted);
        this.results = results;
    }

    void run() {
        timeOrder();
        currentState();
        lateUpdate();
        filledLater();
    }

    /** True when the table keeps a time for each row or a validity period: its rows can be placed in time. */
    boolean timed(String table) {
        if (table.equals(plan.cohort().table())) {
            return false;
        }
        Optional<TableSpec> spec = recipe.table(table);
        return spec.isPresent() && (spec.get().time().isPresent() || spec.get().history().isPresent());
    }

    private List<Counted> asked(Question question) {
        return counted.stream().filter(c -> c.flag().question() == question).toList();
    }

    private void timeOrder() {
        List<Counted> dated = asked(Question.DATED_AFTER);
        if (dated.isEmpty()) {
            results.notApplicable(Check.TIME_ORDER, "No feature reads rows placed in time (every feature is an"
                    + " attribute of the entity row).");
            return;
        }
        long fed = 0;
        for (Counted c : dated) {
            fed += c.fed();
            if (c.rows() > 0) {
                results.find(Finding.of(Check.TIME_ORDER, Severity.BLOCKING, c.flag().outputs(),
                        count(c.rows()) + " of " + count(c.fed()) + " rows that fed the " + c.feed() + " are dated"
                                + " after their cutoff (" + c.flag().table() + "." + c.flag().column()
                                + "): the values of " + columns(c.flag().outputs()) + " see past the cutoff.",
                        counts("rows_fed", c.fed(), "rows_dated_after_cutoff", c.rows()), c.examples(),
                        "The compiled windows should never admit such rows: check how " + c.flag().table() + "."
                                + c.flag().column() + " is stored and report this as a bug in Quern.",
                        at(c.flag().outputs())));
            }
        }
        results.pass(Check.TIME_ORDER, count(dated.size()) + " scans checked by a query apart from the compiled"
                + " one, comparing the date of each fed row's time with its cutoff date: "
                + count(dated.stream().mapToLong(Counted::rows).sum()) + " of " + count(fed)
                + " (entity, cutoff, source row) triples are dated after the cutoff.");
    }

    /**
     * A feature that reads a table with neither time nor history (the entity row, a station reached from a
     * ride) takes the value as the source holds it now. When the table declares its update time, the rows
     * updated after their cutoff are counted: none at all means every value read is as it was at its cutoff.
     */
    private void currentState() {
        List<String> reading = new ArrayList<>();
        Set<String> tables = new LinkedHashSet<>();
        for (OutputColumn column : plan.features()) {
            List<String> untimed = untimedSources(column);
            if (untimed.isEmpty()) {
                continue;
            }
            reading.add(column.name());
            Set<String> untimedTables = new LinkedHashSet<>();
            untimed.forEach(s -> untimedTables.add(s.substring(0, s.indexOf('.'))));
            tables.addAll(untimedTables);
            currentStateFinding(column, untimed, untimedTables);
        }
        if (reading.isEmpty()) {
            results.pass(Check.CURRENT_STATE, "Every feature reads tables with a time or a history ("
                    + count(plan.features().size()) + " features).");
        } else {
            results.pass(Check.CURRENT_STATE, count(reading.size()) + " of " + count(plan.features().size())
                    + " features read a table that keeps no time or history (" + list(new ArrayList<>(tables))
                    + "): " + columns(reading) + ".");
        }
    }

    private void currentStateFinding(OutputColumn column, List<String> untimed, Set<String> untimedTables) {
        String summary = column.name() + " reads " + list(untimed) + ", and " + list(new ArrayList<>(untimedTables))
                + (untimedTables.size() == 1 ? " keeps" : " keep") + " no time or history: the value is as the"
                + " source holds it now and may have been written after the cutoff.";
        Map<String, Object> counts = new LinkedHashMap<>();
        List<String> examples = new ArrayList<>();
        boolean allDeclareUpdates = true;
        long fed = 0;
        long late = 0;
        List<String> updateColumns = new ArrayList<>();
        for (String table : untimedTables) {
            Optional<String> updated = recipe.table(table).flatMap(TableSpec::updated).map(n -> n.text());
            if (updated.isEmpty()) {
                allDeclareUpdates = false;
                continue;
            }
            updateColumns.add(table + "." + updated.get());
            for (Counted c : asked(Question.UPDATED_AFTER)) {
                if (c.flag().table().equals(table) && c.flag().outputs().contains(column.name())) {
                    fed += c.fed();
                    late += c.rows();
                    c.examples().stream().limit(SourceRows.EXAMPLES - examples.size()).forEach(examples::add);
                }
            }
        }
        Severity severity = Severity.BLOCKING;
        if (!updateColumns.isEmpty()) {
            counts.put("rows_read", fed);
            counts.put("rows_updated_after_cutoff", late);
            summary += " " + count(late) + " of " + count(fed) + " rows read were updated after their cutoff ("
                    + list(updateColumns) + ").";
            if (allDeclareUpdates && late == 0) {
                severity = Severity.NOTE;
                summary += " None was: every value read is as it was at its cutoff, as far as the update time"
                        + " tells.";
            }
        } else {
            summary += " No update time is declared (`updated:`), so the audit cannot tell when values were"
                    + " written.";
        }
        results.find(Finding.of(Check.CURRENT_STATE, severity, List.of(column.name()), summary, counts, examples,
                "Read the value as of the cutoff from a table with a history (valid_from/valid_to) or from"
                        + " events, or acknowledge it under audit.acknowledge with a reason why it was known at"
                        + " each cutoff.",
                column.definedAt()));
    }

    /** The sources of a column (besides time columns) in tables that keep no time or history. */
    List<String> untimedSources(OutputColumn column) {
        List<String> out = new ArrayList<>();
        for (String source : column.sources()) {
            int dot = source.indexOf('.');
            if (dot > 0 && !timed(source.substring(0, dot))) {
                out.add(source);
            }
        }
        return out;
    }

    private void lateUpdate() {
        List<Counted> updates = asked(Question.UPDATED_AFTER).stream().filter(c -> timed(c.flag().table())).toList();
        if (updates.isEmpty()) {
            Set<String> untimedWithUpdates = new LinkedHashSet<>();
            asked(Question.UPDATED_AFTER).forEach(c -> untimedWithUpdates.add(c.flag().table()));
            results.notApplicable(Check.LATE_UPDATE, "No table with a time or a history that the features read"
                    + " declares an update time (`updated:`)" + (untimedWithUpdates.isEmpty() ? "."
                    : "; the updates of " + list(new ArrayList<>(untimedWithUpdates)) + " are counted under"
                    + " current-state."));
            return;
        }
        long fed = 0;
        long late = 0;
        Set<String> tables = new LinkedHashSet<>();
        for (Counted c : updates) {
            fed += c.fed();
            late += c.rows();
            tables.add(c.flag().table() + "." + c.flag().column());
            if (c.rows() > 0) {
                results.find(Finding.of(Check.LATE_UPDATE, Severity.WARNING, c.flag().outputs(),
                        count(c.rows()) + " of " + count(c.fed()) + " rows that fed the " + c.feed() + " were"
                                + " updated after their cutoff (" + c.flag().table() + "." + c.flag().column()
                                + "): " + columns(c.flag().outputs()) + " may hold values that were not known then.",
                        counts("rows_fed", c.fed(), "rows_updated_after_cutoff", c.rows()), c.examples(),
                        "Read the values as of the cutoff from a history table, or acknowledge the columns with a"
                                + " reason if the updates never change them.",
                        at(c.flag().outputs())));
            }
        }
        results.pass(Check.LATE_UPDATE, "Update times " + list(new ArrayList<>(tables)) + ": " + count(late)
                + " of " + count(fed) + " rows that fed a feature were updated after their cutoff.");
    }

    private void filledLater() {
        List<Counted> filled = asked(Question.FILLED_AFTER);
        List<String> declared = new ArrayList<>();
        recipe.tables().values().forEach(t -> t.filled().forEach(f -> declared.add(t.name().text() + "."
                + f.column().text() + " (at " + f.at().text() + ")")));
        if (filled.isEmpty()) {
            results.notApplicable(Check.FILLED_LATER, declared.isEmpty()
                    ? "No column is declared as filled in later (`filled:`)."
                    : "No feature reads a column filled in later (" + list(declared) + ").");
            return;
        }
        long fed = 0;
        long late = 0;
        for (Counted c : filled) {
            fed += c.fed();
            late += c.rows();
            if (c.rows() > 0) {
                String column = c.flag().table() + "." + c.flag().column();
                String at = c.flag().at().orElseThrow();
                results.find(Finding.of(Check.FILLED_LATER, Severity.BLOCKING, c.flag().outputs(),
                        count(c.rows()) + " of " + count(c.fed()) + " rows that fed " + columns(c.flag().outputs())
                                + " had " + column + " filled in after their cutoff (" + c.flag().table() + "." + at
                                + " after the cutoff, or empty): those values were not known at the cutoff.",
                        counts("rows_fed", c.fed(), "rows_filled_after_cutoff", c.rows()), c.examples(),
                        "Count " + column + " only where " + at + " is on or before the cutoff (a filter on the"
                                + " block), or leave it out.",
                        at(c.flag().outputs())));
            }
        }
        results.pass(Check.FILLED_LATER, "Columns filled in later: " + list(declared) + "; " + count(late) + " of "
                + count(fed) + " rows that fed a feature with such a value had it filled in after their cutoff.");
    }

    /** Where the first of these columns is defined in the recipe. */
    private Position at(List<String> outputs) {
        return plan.columns().stream().filter(c -> !outputs.isEmpty() && c.name().equals(outputs.get(0)))
                .map(OutputColumn::definedAt).findFirst().orElse(Position.NONE);
    }

    private static Map<String, Object> counts(String k1, long v1, String k2, long v2) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put(k1, v1);
        m.put(k2, v2);
        return m;
    }
}
