package dev.quern.report;

import dev.quern.Position;
import dev.quern.plan.Role;
import dev.quern.schema.ValueType;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.stream.Collectors;

/** Where one output column comes from: its steps from the source rows to the column, and its recipe line. */
public record ColumnLineage(String column, Role role, ValueType type, List<LineageStep> steps, Position definedAt) {

    /** Between steps of the one-line form. */
    static final String ARROW = " > ";

    public ColumnLineage {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(role, "role");
        Objects.requireNonNull(type, "type");
        steps = List.copyOf(steps);
        Objects.requireNonNull(definedAt, "definedAt");
    }

    /** The compact form the data dictionary carries: {@code rides > join ... > window 30d on ... > count}. */
    public String oneLine() {
        return steps.stream().map(LineageStep::text).collect(Collectors.joining(ARROW));
    }

    /** Every source column read on the way, in step order, once each. */
    public List<String> sources() {
        Set<String> out = new LinkedHashSet<>();
        steps.forEach(s -> s.uses().forEach(u -> out.add(u.column())));
        return List.copyOf(out);
    }

    /** What {@code source} ({@code table.column}, or a table) is read for in this column; empty when not read. */
    public List<LineageStep.How> uses(String source) {
        Set<LineageStep.How> out = new LinkedHashSet<>();
        for (LineageStep s : steps) {
            for (LineageStep.Use u : s.uses()) {
                if (u.column().equals(source) || u.table().equals(source)) {
                    out.add(u.how());
                }
            }
        }
        return List.copyOf(out);
    }

    /** {@code recipes/churn.yaml:50}, or empty when no recipe line defined it. */
    public String recipeLine() {
        return definedAt.isKnown() ? definedAt.file() + ":" + definedAt.line() : "";
    }

    /** The lineage as JSON values (maps and lists in a stable order). */
    public Map<String, Object> json() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("column", column);
        m.put("role", role.label());
        m.put("type", type.label());
        m.put("defined_at", recipeLine());
        m.put("sources", sources());
        List<Object> steps = new ArrayList<>();
        for (LineageStep s : this.steps) {
            Map<String, Object> step = new LinkedHashMap<>();
            step.put("step", s.kind());
            step.putAll(s.fields());
            steps.add(step);
        }
        m.put("steps", steps);
        m.put("line", oneLine());
        return m;
    }
}
