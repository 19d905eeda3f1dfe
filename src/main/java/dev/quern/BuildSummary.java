package dev.quern;

import dev.quern.run.RuleOutcome;
import dev.quern.run.RunResult;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;

/** What a build wrote and how it went. */
public record BuildSummary(Compilation compilation, RunResult run, List<RuleOutcome> rules, List<Path> files) {
    public BuildSummary {
        Objects.requireNonNull(compilation, "compilation");
        Objects.requireNonNull(run, "run");
        rules = List.copyOf(rules);
        files = List.copyOf(files);
    }
}
