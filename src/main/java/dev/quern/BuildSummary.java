package dev.quern;

import dev.quern.audit.AuditReport;
import dev.quern.run.RunResult;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;

/** What a build wrote and how it went, with what the leakage audit found. */
public record BuildSummary(Compilation compilation, RunResult run, AuditReport audit, List<Path> files) {
    public BuildSummary {
        Objects.requireNonNull(compilation, "compilation");
        Objects.requireNonNull(run, "run");
        Objects.requireNonNull(audit, "audit");
        files = List.copyOf(files);
    }
}
