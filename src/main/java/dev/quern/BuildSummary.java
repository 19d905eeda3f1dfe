package dev.quern;

import dev.quern.plan.OutputColumn;
import dev.quern.run.RuleOutcome;
import dev.quern.run.RunResult;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;

/**
 * What a build wrote and how it went. {@code columns} are the matrix's columns as written: the plan's, or
 * after the encode stage the encoded ones.
 */
public record BuildSummary(Compilation compilation, RunResult run, List<RuleOutcome> rules, List<Path> files,
                           List<OutputColumn> columns) {
    public BuildSummary {
        Objects.requireNonNull(compilation, "compilation");
        Objects.requireNonNull(run, "run");
        rules = List.copyOf(rules);
        files = List.copyOf(files);
        columns = List.copyOf(columns);
    }

    /** A build without an encode stage: the matrix has the plan's columns. */
    public BuildSummary(Compilation compilation, RunResult run, List<RuleOutcome> rules, List<Path> files) {
        this(compilation, run, rules, files, compilation.plan().columns());
    }
}
