package dev.quern.report;

import dev.quern.Diagnostic;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.Suggestions;
import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import dev.quern.plan.Cohort;
import dev.quern.plan.EventPath;
import dev.quern.plan.Hop;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.Lookup;
import dev.quern.plan.LookupColumn;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Lineage of every output column, derived from the plan: for each column the chain from source table and
 * columns through links, time rule and measure to the column, with the recipe line that defined it; and
 * the reverse, every column a source column feeds.
 */
public final class Lineage {

    /** A column fed by a source, and what the source is read for in it. */
    public record Fed(ColumnLineage column, List<LineageStep.How> uses) {
        public Fed {
            uses = List.copyOf(uses);
        }
    }

    private final List<ColumnLineage> columns;

    private Lineage(List<ColumnLineage> columns) {
        this.columns = List.copyOf(columns);
    }

    /** The lineage of every output column of {@code plan}, in output order. */
    public static Lineage of(Plan plan) {
        Map<String, List<LineageStep>> known = new LinkedHashMap<>();
        for (Block b : plan.blocks()) {
            for (Aggregate a : b.aggregates()) {
                List<LineageStep> steps = path(b.path(), plan.cohort());
                steps.add(new LineageStep.Window(a.window().label(), b.path().time().column().qualified(),
                        "rows with " + b.path().time().column().qualified() + " in [end of cutoff day - "
                                + a.window().label() + ", end of cutoff day)"));
                steps.add(new LineageStep.Measure(a.kind().spelling(), a.input().map(c -> c.qualified())));
                known.put(a.column(), steps);
            }
        }
        for (Lookup l : plan.lookups()) {
            for (LookupColumn c : l.columns()) {
                known.put(c.column(), lookup(l, c, plan.cohort()));
            }
        }
        plan.label().ifPresent(l -> known.put(l.column(), label(l, plan.cohort())));
        List<ColumnLineage> out = new ArrayList<>();
        for (OutputColumn c : plan.columns()) {
            List<LineageStep> steps = switch (c.role()) {
                case KEY -> key(plan.cohort());
                case CUTOFF -> List.of(plan.cutoffs().isEmpty() ? new LineageStep.Cutoffs("", "", 0)
                        : new LineageStep.Cutoffs(plan.cutoffs().get(0).toString(),
                                plan.cutoffs().get(plan.cutoffs().size() - 1).toString(), plan.cutoffs().size()));
                default -> Optional.ofNullable(known.get(c.name())).map(ArrayList::new)
                        .orElseGet(() -> new ArrayList<>(List.of(new LineageStep.Reads("defined by the recipe",
                                c.sources()))));
            };
            out.add(new ColumnLineage(c.name(), c.role(), c.type(), withFilter(steps, c), c.definedAt()));
        }
        return new Lineage(out);
    }

    public List<ColumnLineage> columns() {
        return columns;
    }

    /** The lineage of one column, or a usage mistake that names the closest column. */
    public ColumnLineage column(String name) {
        return columns.stream().filter(c -> c.column().equals(name)).findFirst()
                .orElseThrow(() -> usage("no output column '" + name + "'"
                        + Suggestions.hint(name, columns.stream().map(ColumnLineage::column).toList())));
    }

    /** Every source column read by some output column ({@code table.column}), in first-use order. */
    public List<String> sources() {
        Set<String> out = new LinkedHashSet<>();
        columns.forEach(c -> out.addAll(c.sources()));
        return List.copyOf(out);
    }

    /**
     * Every output column that {@code source} feeds: a source column as {@code table.column}, or a whole
     * table by its name. A source no column reads is a usage mistake that names the closest one.
     */
    public List<Fed> fedBy(String source) {
        List<Fed> out = new ArrayList<>();
        for (ColumnLineage c : columns) {
            List<LineageStep.How> uses = c.uses(source);
            if (!uses.isEmpty()) {
                out.add(new Fed(c, uses));
            }
        }
        if (out.isEmpty()) {
            Set<String> known = new LinkedHashSet<>(sources());
            sources().forEach(s -> known.add(s.substring(0, s.indexOf('.'))));
            throw usage("no output column reads '" + source + "'" + Suggestions.hint(source, known)
                    + "; name a source column as table.column, or a table");
        }
        return out;
    }

    private static List<LineageStep> key(Cohort cohort) {
        List<LineageStep> steps = new ArrayList<>();
        steps.add(new LineageStep.Table(cohort.table()));
        List<String> until = cohort.exits().stream().map(e -> e.time().column().qualified()).toList();
        if (cohort.since().isPresent() || !until.isEmpty()) {
            steps.add(new LineageStep.Eligibility(cohort.since().map(s -> s.column().qualified()), until));
        }
        steps.add(new LineageStep.Value(cohort.key().qualified(), LineageStep.How.KEY));
        return steps;
    }

    /** The table, the join to the entity and the joins along the path's hops. */
    private static List<LineageStep> path(EventPath path, Cohort cohort) {
        List<LineageStep> steps = new ArrayList<>();
        steps.add(new LineageStep.Table(path.table()));
        steps.add(new LineageStep.Join(path.entityLink().qualified(), cohort.key().qualified(), true));
        for (Hop h : path.hops()) {
            steps.add(new LineageStep.Join(h.link().qualified(), h.table() + "." + h.key(), false));
        }
        return steps;
    }

    private static List<LineageStep> lookup(Lookup lookup, LookupColumn column, Cohort cohort) {
        List<LineageStep> steps = new ArrayList<>();
        if (lookup instanceof Lookup.EntityAttributes e) {
            steps.add(new LineageStep.Table(e.table()));
            steps.add(new LineageStep.AsOf("current", List.of(), "the value as the source holds it now: "
                    + e.table() + " keeps no history of it, so it may have been written after the cutoff"));
        } else if (lookup instanceof Lookup.InForce f) {
            steps.add(new LineageStep.Table(f.table()));
            steps.add(new LineageStep.Join(f.entityLink().qualified(), cohort.key().qualified(), true));
            String from = f.from().column().qualified();
            String to = f.to().column().qualified();
            steps.add(new LineageStep.AsOf("in_force", List.of(from, to), "the row with " + from
                    + " before the end of the cutoff day and " + to + " empty or not before it; the latest "
                    + f.from().column().column() + " wins, then the highest key"));
        } else if (lookup instanceof Lookup.Latest l) {
            steps.addAll(path(l.path(), cohort));
            String time = l.path().time().column().qualified();
            steps.add(new LineageStep.AsOf("latest", List.of(time), "the latest row with " + time
                    + " before the end of the cutoff day; ties broken by the key"));
        }
        steps.add(new LineageStep.Value(column.source().qualified(), LineageStep.How.VALUE));
        return steps;
    }

    private static List<LineageStep> label(LabelPlan label, Cohort cohort) {
        List<LineageStep> steps = path(label.path(), cohort);
        steps.add(new LineageStep.Horizon(label.horizon().label(), label.gap().label(),
                label.path().time().column().qualified()));
        steps.add(new LineageStep.Measure(label.kind().spelling(), label.input().map(c -> c.qualified())));
        return steps;
    }

    /** A filter the plan records on the column goes after the joins, before the time rule picks rows. */
    private static List<LineageStep> withFilter(List<LineageStep> steps, OutputColumn column) {
        if (column.filter().isEmpty() || column.filter().get().isBlank()) {
            return steps;
        }
        List<LineageStep> out = new ArrayList<>(steps);
        int at = 0;
        while (at < out.size()
                && (out.get(at) instanceof LineageStep.Table || out.get(at) instanceof LineageStep.Join)) {
            at++;
        }
        out.add(at, new LineageStep.Filter(column.filter().get(), List.of()));
        return out;
    }

    private static QuernException usage(String message) {
        return new QuernException(Failure.USAGE, List.of(Diagnostic.at(Position.NONE, message)));
    }

    /** The terminal form of some columns' lineage: one block per column. */
    public static String text(List<ColumnLineage> columns) {
        StringBuilder out = new StringBuilder();
        for (ColumnLineage c : columns) {
            if (out.length() > 0) {
                out.append('\n');
            }
            out.append(c.column()).append(" (").append(c.role().label()).append(", ").append(c.type().label());
            if (!c.recipeLine().isEmpty()) {
                out.append(", defined at ").append(c.recipeLine());
            }
            out.append(")\n");
            for (LineageStep s : c.steps()) {
                String text = s.text().startsWith(s.kind() + " ") ? s.text().substring(s.kind().length() + 1)
                        : s.text();
                out.append("  ").append(String.format(java.util.Locale.ROOT, "%-8s", s.kind())).append(' ')
                        .append(text);
                if (!s.note().isEmpty()) {
                    out.append("\n           ").append(s.note());
                }
                out.append('\n');
            }
        }
        return out.toString();
    }

    /** The terminal form of the reverse lineage of {@code source}. */
    public static String text(String source, List<Fed> fed) {
        StringBuilder out = new StringBuilder();
        out.append(source).append(" feeds ").append(fed.size()).append(fed.size() == 1 ? " column" : " columns")
                .append(":\n");
        int width = fed.stream().mapToInt(f -> f.column().column().length()).max().orElse(0);
        for (Fed f : fed) {
            out.append("  ").append(String.format(java.util.Locale.ROOT, "%-" + width + "s", f.column().column()))
                    .append("  ").append(String.format(java.util.Locale.ROOT, "%-10s",
                            String.join(",", f.uses().stream().map(LineageStep.How::label).toList())))
                    .append("  ").append(f.column().recipeLine()).append('\n');
        }
        return out.toString();
    }

    /** JSON for some columns' lineage: a list of column objects. */
    public static String json(List<ColumnLineage> columns) {
        return Json.write(columns.stream().map(ColumnLineage::json).toList());
    }

    /** JSON for the reverse lineage of {@code source}. */
    public static String json(String source, List<Fed> fed) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("from", source);
        List<Object> list = new ArrayList<>();
        for (Fed f : fed) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("column", f.column().column());
            m.put("uses", f.uses().stream().map(LineageStep.How::label).toList());
            m.put("defined_at", f.column().recipeLine());
            m.put("line", f.column().oneLine());
            list.add(m);
        }
        root.put("columns", list);
        return Json.write(root);
    }
}
