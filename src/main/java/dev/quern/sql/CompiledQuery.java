package dev.quern.sql;

import dev.quern.plan.Plan;
import java.util.List;
import java.util.Objects;

/**
 * What builds the modelling table, rendered for the plan's engine. Without scans, {@code sql} is the one
 * query of the whole matrix in output order and {@code columns} are all its columns. With scans (blocks in
 * {@link BlockShape#ORDERED_SCAN}), {@code sql} gives every other column ordered by key then cutoff, and the
 * run stage adds the scanned blocks' and the derived columns; {@code columns} are then the query's only.
 */
public record CompiledQuery(Plan plan, String sql, String formattedSql, List<String> columns, List<BlockScan> scans,
                            List<ShapeChoice> choices) {
    public CompiledQuery {
        Objects.requireNonNull(plan, "plan");
        Objects.requireNonNull(sql, "sql");
        Objects.requireNonNull(formattedSql, "formattedSql");
        columns = List.copyOf(columns);
        scans = List.copyOf(scans);
        choices = List.copyOf(choices);
    }

    /** True when the run stage merges scanned blocks into the query's rows. */
    public boolean scanned() {
        return !scans.isEmpty();
    }

    /** Why each block has its shape, as SQL comment lines. */
    public String explain() {
        return Explain.of(this);
    }

    /** Every statement, as {@code quern sql} prints it: the main query, then each scan with its block. */
    public String script() {
        StringBuilder out = new StringBuilder(formattedSql).append(";\n");
        for (BlockScan scan : scans) {
            out.append("\n-- ").append(scan.block().name()).append(" (").append(scan.block().path().text())
                    .append("): ordered scan, windows computed as rows stream by\n")
                    .append(scan.formattedSql()).append(";\n");
        }
        return out.toString();
    }
}
