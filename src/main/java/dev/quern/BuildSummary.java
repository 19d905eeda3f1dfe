package dev.quern;

import dev.quern.audit.AuditReport;
import dev.quern.plan.OutputColumn;
import dev.quern.report.Comparison;
import dev.quern.run.RuleOutcome;
import dev.quern.run.RunResult;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What a build wrote and how it went. {@code columns} are the matrix's columns as written: the plan's, or
 * after the encode stage the encoded ones; {@code drift} is the comparison with an earlier build when one
 * was named; {@code audit} is what the leakage audit found.
 */
public record BuildSummary(Compilation compilation, RunResult run, List<RuleOutcome> rules, List<Path> files,
                           List<OutputColumn> columns, Optional<Comparison> drift, AuditReport audit) {
    public BuildSummary {
        Objects.requireNonNull(compilation, "compilation");
        Objects.requireNonNull(run, "run");
        rules = List.copyOf(rules);
        files = List.copyOf(files);
        columns = List.copyOf(columns);
        Objects.requireNonNull(drift, "drift");
        Objects.requireNonNull(audit, "audit");
    }
}
