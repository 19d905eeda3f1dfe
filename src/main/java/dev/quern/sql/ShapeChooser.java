package dev.quern.sql;

import dev.quern.plan.Block;
import dev.quern.plan.ColumnRef;
import dev.quern.plan.Plan;
import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Optional;

/**
 * Picks each block's shape for the plan's engine. The defaults follow measurements on a two-core machine
 * (20,000 members, 12 month-end cutoffs, 1.4M rides; see the README's performance section for the
 * benchmark that keeps them honest); a shape asked for by name is used wherever it can compute the block.
 */
final class ShapeChooser {

    private ShapeChooser() {
    }

    static List<ShapeChoice> choose(Plan plan, Optional<BlockShape> asked) {
        return plan.blocks().stream().map(b -> choose(plan, b, asked)).toList();
    }

    private static ShapeChoice choose(Plan plan, Block block, Optional<BlockShape> asked) {
        Optional<String> noScan = whyNoScan(plan, block);
        if (asked.isPresent()) {
            if (asked.get() == BlockShape.ORDERED_SCAN && noScan.isPresent()) {
                return new ShapeChoice(block, BlockShape.RANGE_JOIN,
                        "ordered-scan was asked for, but " + noScan.get());
            }
            return new ShapeChoice(block, asked.get(), asked.get().spelling() + " was asked for");
        }
        if (noScan.isPresent()) {
            return new ShapeChoice(block, BlockShape.RANGE_JOIN, noScan.get());
        }
        return switch (plan.engine()) {
            case SQLITE -> new ShapeChoice(block, BlockShape.ORDERED_SCAN,
                    "SQLite joins by nested loops: a range join probes the path once per (entity, cutoff) and reads"
                            + " each row once per cutoff whose window holds it; one scan ordered by key reads it once"
                            + " (the benchmark at 1M and 2M rides: 29.2 and 60.2 s range join, 5.4 and 9.7 s ordered scan,"
                            + " whole builds, medians of three)");
            case DUCKDB -> new ShapeChoice(block, BlockShape.ORDERED_SCAN,
                    "DuckDB sorts and streams a table a little faster than it joins every row to each cutoff's"
                            + " cohort (the benchmark at 1M and 2M rides: 4.1 and 6.3 s ordered scan, 4.6 and 9.4 s"
                            + " range join, whole builds, medians of three)");
            case POSTGRES, MARIADB, MYSQL -> new ShapeChoice(block, BlockShape.RANGE_JOIN,
                    "the engine's hash join and grouping compute every window in one pass; the ordered scan has"
                            + " not been measured on " + plan.engine().label() + " (ask for it with --shape ordered-scan)");
            case SPARK -> new ShapeChoice(block, BlockShape.RANGE_JOIN,
                    "Spark spreads the join and the grouping over its executors");
        };
    }

    /** Why the ordered scan cannot compute this block, if it cannot. */
    static Optional<String> whyNoScan(Plan plan, Block block) {
        if (plan.engine() == Engine.SPARK) {
            return Optional.of("on Spark an ordered scan would pull every row of the path through the driver,"
                    + " one machine, which is what Spark is there to avoid");
        }
        if (block.filter().map(f -> f.usesCutoff()).orElse(false)) {
            return Optional.of("the block's where uses the cutoff, which a scan over all cutoffs at once cannot"
                    + " evaluate per row");
        }
        ColumnRef key = plan.cohort().key();
        ColumnRef link = block.path().entityLink();
        if (key.type() != link.type() || !(key.type() == ValueType.INTEGER || key.type() == ValueType.TEXT)) {
            return Optional.of("the entity key " + key.qualified() + " (" + key.type().label() + ") and the link "
                    + link.qualified() + " (" + link.type().label() + ") must both be integer or both text for"
                    + " the scan to merge them in key order");
        }
        return Optional.empty();
    }

}
