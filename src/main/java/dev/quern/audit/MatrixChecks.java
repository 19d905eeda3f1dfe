package dev.quern.audit;

import static dev.quern.audit.Results.count;
import static dev.quern.audit.Results.decimal;
import static dev.quern.audit.Results.list;

import dev.quern.Position;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** The checks on the matrix's rows: the cohort and the single-feature screen. */
final class MatrixChecks {

    private final Plan plan;
    private final Results results;
    private final double auc;
    private final double rho;

    MatrixChecks(Plan plan, double auc, double rho, Results results) {
        this.plan = plan;
        this.auc = auc;
        this.rho = rho;
        this.results = results;
    }

    void cohort(MatrixScan.CohortFacts facts, boolean sinceChecked) {
        OutputColumn key = plan.columns().get(0);
        String since = plan.cohort().since().map(s -> s.column().qualified()).orElse("");
        if (facts.beforeSince() > 0) {
            results.find(Finding.of(Check.COHORT, Severity.BLOCKING, List.of(key.name()),
                    count(facts.beforeSince()) + " of " + count(facts.rows()) + " rows describe an entity at a cutoff"
                            + " before its since date (" + since + "): it did not exist yet, and its row tells the"
                            + " model it will.",
                    Map.of("rows", facts.rows(), "rows_before_since", facts.beforeSince()),
                    facts.beforeSinceExamples(),
                    "Check the values of " + since + "; the compiled cohort keeps only entities whose since date is"
                            + " on or before the cutoff, so report this as a bug in Quern if they are right.",
                    key.definedAt()));
        }
        if (facts.repeated() > 0) {
            results.find(Finding.of(Check.COHORT, Severity.BLOCKING, List.of(key.name()),
                    count(facts.repeated()) + " rows repeat a (" + key.name() + ", cutoff) pair already in the"
                            + " matrix: the entity counts twice at that cutoff.",
                    Map.of("rows", facts.rows(), "rows_repeated", facts.repeated()), facts.repeatedExamples(),
                    "Make " + plan.cohort().key().qualified() + " unique as written: a view that repeats rows, or a"
                            + " key stored both as a number and as text (5 and '5'), passes the key check but repeats"
                            + " the entity.",
                    key.definedAt()));
        }
        results.pass(Check.COHORT, count(facts.rows()) + " rows of the matrix checked: "
                + (sinceChecked ? count(facts.beforeSince()) + " at a cutoff before their entity's since date ("
                + since + "), " : "no since date to compare with, ")
                + count(facts.repeated()) + " repeating a (" + key.name() + ", cutoff) pair.");
    }

    void screen(Optional<MatrixScan.Screen> screen) {
        if (screen.isEmpty()) {
            results.notApplicable(Check.SINGLE_FEATURE, "The recipe has no label.");
            return;
        }
        MatrixScan.Screen s = screen.get();
        if (s.columns().isEmpty()) {
            results.notApplicable(Check.SINGLE_FEATURE, s.labelled() < 2
                    ? "Fewer than two rows have a label."
                    : s.binary() ? "Every labelled row has the same label (" + count(s.labelled()) + " rows)."
                    : "No column could be screened.");
            return;
        }
        for (MatrixScan.Screened c : s.columns()) {
            if (suspicious(c)) {
                Map<String, Object> counts = new LinkedHashMap<>();
                counts.put(c.statistic(), round(c.value()));
                counts.put("rows", c.rows());
                if (s.binary()) {
                    counts.put("positives", c.positives());
                }
                results.find(Finding.of(Check.SINGLE_FEATURE, Severity.WARNING, List.of(c.column()),
                        c.column() + " alone predicts " + s.label() + " almost perfectly: " + describe(c, s) + ".",
                        counts, List.of(),
                        "Find out why this column alone predicts the label: if it is known before the cutoff and"
                                + " truly that strong, acknowledge it with a reason; otherwise it leaks the label.",
                        position(c.column())));
            }
        }
        MatrixScan.Screened strongest = s.columns().stream()
                .filter(c -> !Double.isNaN(c.value()))
                .max(Comparator.comparingDouble(c -> strength(c))).orElse(s.columns().get(0));
        String thresholds = s.binary()
                ? "AUC at or above " + decimal(auc) + " or at or below " + decimal(1 - auc)
                : "|rho| at or above " + decimal(rho);
        results.pass(Check.SINGLE_FEATURE, count(s.columns().size()) + " columns screened against " + s.label()
                + (s.binary() ? " (binary: " + count(s.positives()) + " of " + count(s.labelled())
                + " labelled rows are 1; AUC, Mann-Whitney U / (n1 n0), ties one half)"
                : " (numeric: " + count(s.labelled()) + " labelled rows; Spearman's rho)")
                + "; rows with an empty label left out, empty values ranked lowest. Flagged: " + thresholds
                + ". Strongest: " + strongest.column() + " " + strongest.statistic() + " "
                + decimal(strongest.value()) + "."
                + (s.skipped().isEmpty() ? "" : " Not screened: " + list(s.skipped()) + "."));
    }

    private boolean suspicious(MatrixScan.Screened c) {
        if (Double.isNaN(c.value())) {
            return false;
        }
        return c.statistic().equals("auc") ? c.value() >= auc || c.value() <= 1 - auc : Math.abs(c.value()) >= rho;
    }

    private static double strength(MatrixScan.Screened c) {
        return c.statistic().equals("auc") ? Math.abs(c.value() - 0.5) : Math.abs(c.value()) / 2;
    }

    private static String describe(MatrixScan.Screened c, MatrixScan.Screen s) {
        return c.statistic().equals("auc")
                ? "AUC " + decimal(c.value()) + " over " + count(c.rows()) + " labelled rows (" + count(c.positives())
                + " of them 1)"
                : "Spearman's rho " + decimal(c.value()) + " over " + count(c.rows()) + " labelled rows";
    }

    private static double round(double v) {
        return Math.round(v * 1e6) / 1e6;
    }

    private Position position(String column) {
        return plan.columns().stream().filter(c -> c.name().equals(column)).map(OutputColumn::definedAt)
                .findFirst().orElse(Position.NONE);
    }
}
