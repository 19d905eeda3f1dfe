package dev.quern;

import dev.quern.report.Comparison;
import dev.quern.run.RunResult;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/** What a build wrote and how it went, with the drift against an earlier build when one was named. */
public record BuildSummary(Compilation compilation, RunResult run, List<Path> files, Optional<Comparison> drift) {
    public BuildSummary {
        Objects.requireNonNull(compilation, "compilation");
        Objects.requireNonNull(run, "run");
        files = List.copyOf(files);
        Objects.requireNonNull(drift, "drift");
    }

    public BuildSummary(Compilation compilation, RunResult run, List<Path> files) {
        this(compilation, run, files, Optional.empty());
    }
}
