package dev.quern.plan;

import dev.quern.schema.Engine;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * The logical plan of a build: the data-quality rules, the cohort, one block per scanned path, the lookups,
 * the derived columns and the label, and the output columns in their final order (key, cutoff, features in
 * recipe order, label last). It holds no SQL: the sql stage renders it for an engine.
 */
public record Plan(String recipeName, Engine engine, Optional<ZoneId> timeZone, List<LocalDate> cutoffs,
                   Cohort cohort, List<Block> blocks, List<Lookup> lookups, List<DerivedColumn> derived,
                   Optional<LabelPlan> label, List<RulePlan> rules, List<OutputColumn> columns) {

    public Plan {
        Objects.requireNonNull(recipeName, "recipeName");
        Objects.requireNonNull(engine, "engine");
        Objects.requireNonNull(timeZone, "timeZone");
        cutoffs = List.copyOf(cutoffs);
        Objects.requireNonNull(cohort, "cohort");
        blocks = List.copyOf(blocks);
        lookups = List.copyOf(lookups);
        derived = List.copyOf(derived);
        rules = List.copyOf(rules);
        Objects.requireNonNull(label, "label");
        columns = List.copyOf(columns);
    }

    /** Every boundary some part of the plan compares with, once each, in a stable order. */
    public List<Boundary> boundaries() {
        Map<String, Boundary> out = new LinkedHashMap<>();
        Boundary end = new Boundary.CutoffEnd();
        out.put(end.column(), end);
        for (Block b : blocks) {
            for (var w : b.windows()) {
                Boundary start = new Boundary.WindowStart(w);
                out.putIfAbsent(start.column(), start);
            }
        }
        label.ifPresent(l -> {
            out.put(l.start().column(), l.start());
            out.put(l.end().column(), l.end());
        });
        return List.copyOf(out.values());
    }

    /** The rules that take rows out of {@code table} before anything reads it. */
    public List<RulePlan> exclusions(String table) {
        return rules.stream().filter(r -> r.table().equals(table)
                && r.failing() == dev.quern.recipe.RuleSpec.Failing.EXCLUDE).toList();
    }

    /**
     * The same plan at other cutoffs: a scoring run's {@code --cutoffs}. The columns do not depend on the
     * cutoffs, so they stay exactly the same.
     */
    public Plan withCutoffs(List<LocalDate> dates) {
        return new Plan(recipeName, engine, timeZone, List.copyOf(new java.util.TreeSet<>(dates)), cohort, blocks,
                lookups, derived, label, rules, columns);
    }

    /** The same plan describing other output columns: the matrix after the encode stage. */
    public Plan withColumns(List<OutputColumn> outputs) {
        return new Plan(recipeName, engine, timeZone, cutoffs, cohort, blocks, lookups, derived, label, rules, outputs);
    }

    public List<OutputColumn> features() {
        return columns.stream().filter(c -> c.role() == Role.FEATURE).toList();
    }
}
