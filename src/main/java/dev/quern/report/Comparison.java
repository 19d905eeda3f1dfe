package dev.quern.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalLong;

/**
 * Two builds side by side (see {@link Compare}): columns added, removed and retyped, rows per cutoff,
 * each column's drift with its PSI and empty share, and what provenance says changed in recipe and source.
 */
public record Comparison(String oldName, String newName, List<ColumnChange> columnChanges,
                         List<CutoffRows> rows, List<ColumnDrift> drift, List<ProvenanceChange> provenance) {

    public Comparison {
        Objects.requireNonNull(oldName, "oldName");
        Objects.requireNonNull(newName, "newName");
        columnChanges = List.copyOf(columnChanges);
        rows = List.copyOf(rows);
        drift = List.copyOf(drift);
        provenance = List.copyOf(provenance);
    }

    /** A column that only one build has, or that changed type. */
    public record ColumnChange(String column, Change change, String oldType, String newType) {
        public ColumnChange {
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(change, "change");
            Objects.requireNonNull(oldType, "oldType");
            Objects.requireNonNull(newType, "newType");
        }
    }

    public enum Change {
        ADDED, REMOVED, RETYPED;

        public String label() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    /** Rows at one cutoff in each build; empty when the build has no such cutoff. */
    public record CutoffRows(String cutoff, OptionalLong oldRows, OptionalLong newRows) {
        public CutoffRows {
            Objects.requireNonNull(cutoff, "cutoff");
            Objects.requireNonNull(oldRows, "oldRows");
            Objects.requireNonNull(newRows, "newRows");
        }

        /** Relative change, for cutoffs both builds have; 0 when both are 0. */
        public double change() {
            long o = oldRows.orElseThrow();
            long n = newRows.orElseThrow();
            return o == 0 ? (n == 0 ? 0 : Double.POSITIVE_INFINITY) : (double) (n - o) / o;
        }

        public boolean inBoth() {
            return oldRows.isPresent() && newRows.isPresent();
        }
    }

    /** One bin of a column's values: its label and the rows of each build in it. */
    public record Bin(String label, long oldCount, long newCount) {
        public Bin {
            Objects.requireNonNull(label, "label");
        }
    }

    /** A column both builds have, with its bins (from the old build) and PSI. */
    public record ColumnDrift(String column, String role, boolean numeric, List<Bin> bins, double psi,
                              double oldEmptyShare, double newEmptyShare) {
        public ColumnDrift {
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(role, "role");
            bins = List.copyOf(bins);
        }

        public Psi.Reading reading() {
            return Psi.Reading.of(psi);
        }

        public boolean hasPsi() {
            return !Double.isNaN(psi);
        }

        public double emptyChange() {
            return newEmptyShare - oldEmptyShare;
        }
    }

    /** A provenance fact that differs: {@code recipe.sha256}, {@code source.time_columns[rides.started_at].latest}. */
    public record ProvenanceChange(String what, String oldValue, String newValue) {
        public ProvenanceChange {
            Objects.requireNonNull(what, "what");
            Objects.requireNonNull(oldValue, "oldValue");
            Objects.requireNonNull(newValue, "newValue");
        }
    }

    /** What goes beyond the thresholds, one sentence each; empty when the new build may go on. */
    public List<String> findings(Thresholds limits) {
        List<String> out = new ArrayList<>();
        if (!limits.allowColumnChanges()) {
            for (ColumnChange c : columnChanges) {
                if (c.change() == Change.REMOVED) {
                    out.add(c.column() + ": removed (was " + c.oldType() + ")");
                } else if (c.change() == Change.RETYPED) {
                    out.add(c.column() + ": retyped from " + c.oldType() + " to " + c.newType());
                }
            }
        }
        for (CutoffRows r : rows) {
            if (r.inBoth() && Math.abs(r.change()) > limits.maxRowChange()) {
                out.add("cutoff " + r.cutoff() + ": " + r.oldRows().getAsLong() + " -> " + r.newRows().getAsLong()
                        + " rows (" + percent(r.change()) + ", beyond " + limit(limits.maxRowChange()) + ")");
            }
        }
        for (ColumnDrift d : drift) {
            if (d.hasPsi() && d.psi() > limits.maxPsi()) {
                out.add(d.column() + ": PSI " + fixed(d.psi()) + " above " + fixed(limits.maxPsi()) + " ("
                        + d.reading().label() + ")");
            }
            if (Math.abs(d.emptyChange()) > limits.maxEmptyChange()) {
                out.add(d.column() + ": empty share " + fixed(d.oldEmptyShare()) + " -> " + fixed(d.newEmptyShare())
                        + " (change " + fixed(Math.abs(d.emptyChange())) + " above " + fixed(limits.maxEmptyChange())
                        + ")");
            }
        }
        return out;
    }

    /** The comparison for a terminal. */
    public String text(Thresholds limits) {
        StringBuilder out = new StringBuilder();
        out.append("old: ").append(oldName).append('\n');
        out.append("new: ").append(newName).append('\n');
        out.append("\nProvenance\n");
        if (provenance.isEmpty()) {
            out.append("  recipe and source fingerprints are the same\n");
        }
        int width = provenance.stream().mapToInt(p -> p.what().length()).max().orElse(0);
        for (ProvenanceChange p : provenance) {
            out.append("  ").append(pad(p.what(), width)).append("  ").append(p.oldValue()).append(" -> ")
                    .append(p.newValue()).append('\n');
        }
        out.append("\nColumns\n");
        if (columnChanges.isEmpty()) {
            out.append("  the same columns with the same types\n");
        }
        for (ColumnChange c : columnChanges) {
            out.append("  ").append(pad(c.change().label(), 8)).append(c.column()).append(" (")
                    .append(switch (c.change()) {
                        case ADDED -> c.newType();
                        case REMOVED -> c.oldType();
                        case RETYPED -> c.oldType() + " -> " + c.newType();
                    }).append(")\n");
        }
        out.append("\nRows per cutoff\n");
        long same = rows.stream().filter(r -> r.inBoth() && r.oldRows().getAsLong() == r.newRows().getAsLong())
                .count();
        out.append("  ").append(same).append(same == 1 ? " cutoff has" : " cutoffs have")
                .append(" the same rows in both builds\n");
        for (CutoffRows r : rows) {
            if (r.inBoth() && r.oldRows().getAsLong() == r.newRows().getAsLong()) {
                continue;
            }
            out.append("  ").append(r.cutoff()).append("  ")
                    .append(r.oldRows().isPresent() ? Long.toString(r.oldRows().getAsLong()) : "-").append(" -> ")
                    .append(r.newRows().isPresent() ? Long.toString(r.newRows().getAsLong()) : "-");
            if (r.inBoth()) {
                out.append("  (").append(percent(r.change())).append(')');
            } else {
                out.append(r.oldRows().isPresent() ? "  (only in old)" : "  (only in new)");
            }
            out.append('\n');
        }
        out.append("\nDrift (PSI over bins of the old build; below 0.10 stable, 0.10-0.25 moderate,")
                .append(" above 0.25 large)\n");
        int w = Math.max(6, drift.stream().mapToInt(d -> d.column().length()).max().orElse(0));
        out.append("  ").append(pad("column", w)).append("  ").append(pad("psi", 7)).append("  ")
                .append(pad("reading", 14)).append("  empty share\n");
        for (ColumnDrift d : drift) {
            out.append("  ").append(pad(d.column(), w)).append("  ")
                    .append(pad(d.hasPsi() ? fixed(d.psi()) : "-", 7)).append("  ")
                    .append(pad(d.hasPsi() ? d.reading().label() : "no rows", 14)).append("  ")
                    .append(fixed(d.oldEmptyShare())).append(" -> ").append(fixed(d.newEmptyShare())).append('\n');
        }
        List<String> findings = findings(limits);
        out.append("\nThresholds: PSI ").append(fixed(limits.maxPsi())).append(", empty share change ")
                .append(fixed(limits.maxEmptyChange())).append(", rows per cutoff ")
                .append(limit(limits.maxRowChange()))
                .append(limits.allowColumnChanges() ? ", column changes allowed" : ", no column removed or retyped")
                .append('\n');
        if (findings.isEmpty()) {
            out.append("Nothing goes beyond the thresholds.\n");
        } else {
            out.append(findings.size()).append(findings.size() == 1 ? " finding goes" : " findings go")
                    .append(" beyond the thresholds:\n");
            findings.forEach(f -> out.append("  ").append(f).append('\n'));
        }
        return out.toString();
    }

    /** The comparison as JSON. */
    public String json(Thresholds limits) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("old", oldName);
        root.put("new", newName);
        List<Object> prov = new ArrayList<>();
        for (ProvenanceChange p : provenance) {
            prov.add(ordered("what", p.what(), "old", p.oldValue(), "new", p.newValue()));
        }
        root.put("provenance_changes", prov);
        List<Object> cols = new ArrayList<>();
        for (ColumnChange c : columnChanges) {
            cols.add(ordered("column", c.column(), "change", c.change().label(),
                    "old_type", c.oldType().isEmpty() ? null : c.oldType(),
                    "new_type", c.newType().isEmpty() ? null : c.newType()));
        }
        root.put("column_changes", cols);
        List<Object> rs = new ArrayList<>();
        for (CutoffRows r : rows) {
            rs.add(ordered("cutoff", r.cutoff(), "old", r.oldRows().isPresent() ? r.oldRows().getAsLong() : null,
                    "new", r.newRows().isPresent() ? r.newRows().getAsLong() : null));
        }
        root.put("rows_per_cutoff", rs);
        List<Object> ds = new ArrayList<>();
        for (ColumnDrift d : drift) {
            Map<String, Object> m = ordered("column", d.column(), "role", d.role(), "bins_from",
                    d.numeric() ? "deciles" : "levels", "psi", d.hasPsi() ? round(d.psi()) : null, "reading",
                    d.hasPsi() ? d.reading().label() : null);
            m.put("old_empty_share", round(d.oldEmptyShare()));
            m.put("new_empty_share", round(d.newEmptyShare()));
            List<Object> bins = new ArrayList<>();
            for (Bin b : d.bins()) {
                bins.add(ordered("bin", b.label(), "old", b.oldCount(), "new", b.newCount()));
            }
            m.put("bins", bins);
            ds.add(m);
        }
        root.put("drift", ds);
        root.put("thresholds", ordered("max_psi", limits.maxPsi(), "max_empty_change", limits.maxEmptyChange(),
                "max_row_change", limits.maxRowChange(), "allow_column_changes", limits.allowColumnChanges()));
        root.put("findings", findings(limits));
        return Json.write(root);
    }

    private static Map<String, Object> ordered(Object... pairs) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < pairs.length; i += 2) {
            m.put((String) pairs[i], pairs[i + 1]);
        }
        return m;
    }

    /** Rounded to 1e-9 so that JSON does not show floating-point noise. */
    private static double round(double v) {
        return Math.round(v * 1e9) / 1e9;
    }

    static String fixed(double v) {
        return String.format(Locale.ROOT, "%.4f", v);
    }

    static String percent(double v) {
        return Double.isInfinite(v) ? "new rows where there were none"
                : String.format(Locale.ROOT, "%+.1f%%", 100 * v);
    }

    /** A relative threshold as an unsigned percentage. */
    static String limit(double v) {
        return String.format(Locale.ROOT, "%.1f%%", 100 * v);
    }

    private static String pad(String s, int width) {
        return s.length() >= width ? s : s + " ".repeat(width - s.length());
    }
}
