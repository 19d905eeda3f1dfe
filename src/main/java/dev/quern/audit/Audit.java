package dev.quern.audit;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Suggestions;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.recipe.Acknowledgement;
import dev.quern.recipe.Recipe;
import dev.quern.schema.SourceSchema;
import java.nio.file.Path;
import java.sql.Connection;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Consumer;
import java.util.function.Supplier;

/**
 * The leakage audit: checks that no column of a built matrix can see past its cutoff, and reports what it
 * finds with the evidence.
 *
 * <p>It reads the source with queries of its own (never the compiled feature query) and the matrix as
 * written, before the build commits it. {@link #of} checks the recipe's acknowledgements at once, so that a
 * misspelt one stops the build before the query runs; {@link #run} does the checks.
 *
 * <pre>{@code
 * AuditReport report = Audit.of(recipe, plan, schema).run(connection, matrixFile);
 * if (report.blocked()) { ... write report.markdown(), no matrix ... }
 * }</pre>
 */
public final class Audit {

    /** The screen flags an AUC at or above this, or at or below one minus it, unless the recipe says otherwise. */
    public static final double DEFAULT_AUC = 0.95;
    /** The screen flags |Spearman's rho| at or above this, unless the recipe says otherwise. */
    public static final double DEFAULT_RHO = 0.95;

    private final Recipe recipe;
    private final Plan plan;
    private final SourceSchema schema;
    private final Boundaries boundaries;
    private final long memory;

    private Audit(Recipe recipe, Plan plan, SourceSchema schema, Boundaries boundaries, long memory) {
        this.recipe = recipe;
        this.plan = plan;
        this.schema = schema;
        this.boundaries = boundaries;
        this.memory = memory;
    }

    /** The audit of one compiled recipe; stops with a recipe error if an acknowledgement names no check or column. */
    public static Audit of(Recipe recipe, Plan plan, SourceSchema schema) {
        checkAcknowledgements(recipe, plan);
        return new Audit(recipe, plan, schema, Boundaries.PLAN, MatrixScan.BUDGET_BYTES);
    }

    /** The same audit restating the windows with other boundaries: the seam tests plant a faulty window with. */
    Audit withBoundaries(Boundaries other) {
        return new Audit(recipe, plan, schema, other, memory);
    }

    /** The same audit with another memory budget for the screen's values. */
    Audit withMemory(long bytes) {
        return new Audit(recipe, plan, schema, boundaries, bytes);
    }

    /**
     * Runs every check. {@code connection} is the read-only source; {@code matrix} the matrix as written (CSV,
     * the plan's columns in order), read back streaming.
     */
    public AuditReport run(Connection connection, Path matrix) {
        return run(readSource(connection), matrix);
    }

    /**
     * The audit's reads of the source: the rows that fed each block and lookup, and each entity's since date.
     * They do not depend on the matrix, so a build can take them on a connection of its own while the matrix
     * is written.
     */
    public SourceEvidence readSource(Connection connection) {
        return new SourceEvidence(new SourceRows(recipe, plan, schema, boundaries).count(connection),
                EntitySince.read(plan.cohort(), connection, plan.engine()));
    }

    /** Runs every check, with the source's part read beforehand by {@link #readSource}; evidence serves one run. */
    public AuditReport run(SourceEvidence evidence, Path matrix) {
        MatrixScan scan = new MatrixScan(matrix, plan.columns(), evidence.since, memory);
        return run(evidence, scan, scan.first());
    }

    /**
     * Watches the matrix as it is written, taking the first pass over its rows from the records handed to
     * {@link Watch#accept} instead of reading the file back. The evidence is asked for at the first row, and
     * serves this one watch.
     */
    public Watch watch(Supplier<SourceEvidence> evidence) {
        return new Watch(evidence);
    }

    /** Runs every check on a matrix whose rows {@code watched} saw written to {@code matrix}. */
    public AuditReport run(Watch watched, Path matrix) {
        MatrixScan.First first = watched.first();
        MatrixScan scan = new MatrixScan(matrix, plan.columns(), watched.evidence.since, memory);
        return run(watched.evidence, scan, scan.confirmed(first));
    }

    private AuditReport run(SourceEvidence evidence, MatrixScan scan, MatrixScan.First first) {
        Results results = new Results();
        new SourceChecks(recipe, plan, evidence.counted, results).run();
        PlanChecks planChecks = new PlanChecks(recipe, plan, boundaries, results);
        planChecks.horizon();
        double auc = recipe.audit().auc().orElse(DEFAULT_AUC);
        double rho = recipe.audit().rho().orElse(DEFAULT_RHO);
        MatrixChecks matrixChecks = new MatrixChecks(plan, auc, rho, results);
        matrixChecks.screen(plan.label().map(l -> scan.screen(first)));
        matrixChecks.cohort(first.cohort(), evidence.since.applies());
        planChecks.timeSplit(first.cohort().labelledPerCutoff());
        planChecks.sensitive();
        List<CheckResult> checks = new ArrayList<>(results.checks);
        checks.sort(Comparator.comparing(CheckResult::check));
        List<Finding> findings = new ArrayList<>(results.findings);
        findings.sort(Comparator.comparing(Finding::check));
        return new AuditReport(plan.recipeName(), auc, rho, checks, acknowledge(findings));
    }

    /**
     * The matrix's records as the writer writes them (the cells' text, in the plan's column order; the array
     * may be reused for the next record), for the first pass of the audit's matrix checks.
     */
    public final class Watch implements Consumer<String[]> {
        private final Supplier<SourceEvidence> supplier;
        private SourceEvidence evidence;
        private MatrixScan.First first;

        private Watch(Supplier<SourceEvidence> supplier) {
            this.supplier = supplier;
        }

        @Override
        public void accept(String[] record) {
            first().add(i -> record[i]);
        }

        private MatrixScan.First first() {
            if (first == null) {
                evidence = supplier.get();
                first = new MatrixScan.First(plan.columns(), evidence.since);
            }
            return first;
        }
    }

    /**
     * What {@link #readSource} read. The matrix scan notes its findings in it, so it serves one
     * {@link #run(SourceEvidence, Path)}.
     */
    public static final class SourceEvidence {
        private final List<SourceRows.Counted> counted;
        private final EntitySince since;

        private SourceEvidence(List<SourceRows.Counted> counted, EntitySince since) {
            this.counted = List.copyOf(counted);
            this.since = since;
        }
    }

    /**
     * Marks each finding whose every column the recipe acknowledges for its check; an acknowledgement that
     * matches no finding becomes a note, so that stale ones come to light.
     */
    private List<Finding> acknowledge(List<Finding> findings) {
        Map<String, Acknowledgement> byKey = new LinkedHashMap<>();
        for (Acknowledgement a : recipe.audit().acknowledgements()) {
            byKey.put(a.check().text() + "/" + a.column().text(), a);
        }
        Set<String> used = new HashSet<>();
        List<Finding> out = new ArrayList<>();
        for (Finding f : findings) {
            List<Acknowledgement> acks = new ArrayList<>();
            for (String column : f.columns()) {
                Optional.ofNullable(byKey.get(f.check().id() + "/" + column)).ifPresent(acks::add);
            }
            if (!f.columns().isEmpty() && acks.size() == f.columns().size()) {
                acks.forEach(a -> used.add(a.check().text() + "/" + a.column().text()));
                String reason = String.join(" / ", acks.stream().map(Acknowledgement::reason).distinct().toList());
                out.add(f.acknowledge(new Finding.Acknowledged(reason, acks.get(0).position())));
            } else {
                out.add(f);
            }
        }
        for (Map.Entry<String, Acknowledgement> e : byKey.entrySet()) {
            if (!used.contains(e.getKey())) {
                Acknowledgement a = e.getValue();
                Check check = Check.byId(a.check().text()).orElseThrow();
                out.add(Finding.of(check, Severity.NOTE, List.of(a.column().text()),
                        "The recipe acknowledges " + check.id() + " for " + a.column().text() + " (at " + a.position()
                                + "), but the audit found nothing of that kind there.",
                        Map.of(), List.of(), "Remove the acknowledgement, or check that it names the right column.",
                        a.position()));
            }
        }
        out.sort(Comparator.comparing(Finding::check));
        return out;
    }

    /**
     * Stops with a recipe error for each acknowledgement that names a check the audit does not have, or a
     * column the plan does not build: a misspelt acknowledgement would otherwise silently acknowledge nothing.
     */
    public static void checkAcknowledgements(Recipe recipe, Plan plan) {
        Diagnostics problems = new Diagnostics();
        List<String> columns = plan.columns().stream().map(OutputColumn::name).toList();
        for (Acknowledgement a : recipe.audit().acknowledgements()) {
            if (Check.byId(a.check().text()).isEmpty()) {
                problems.error(a.check().position(), "the audit has no check '" + a.check().text() + "'"
                        + Suggestions.hint(a.check().text(), Check.ids()) + "; its checks are "
                        + String.join(", ", Check.ids()));
            }
            if (!columns.contains(a.column().text())) {
                problems.error(a.column().position(), "the recipe builds no column '" + a.column().text()
                        + "' to acknowledge" + Suggestions.hint(a.column().text(), columns));
            }
        }
        problems.throwIfAny(Failure.RECIPE);
    }
}
