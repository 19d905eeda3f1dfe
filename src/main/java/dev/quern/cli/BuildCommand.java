package dev.quern.cli;

import dev.quern.BuildSummary;
import dev.quern.Quern;
import dev.quern.report.Thresholds;
import dev.quern.run.MatrixFormat;
import dev.quern.run.TerminalProgress;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code quern build}: the modelling table and its reports. */
@Command(name = "build", mixinStandardHelpOptions = true,
        description = {"Build the modelling table, data dictionary, provenance and report into a folder.",
                "Writes matrix.csv, dictionary.csv, dictionary.md, provenance.json and report.html; with "
                        + "--compare-to, report.html also shows the drift against an earlier build."})
final class BuildCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Option(names = {"-o", "--out"}, required = true, paramLabel = "DIR", description = "The output folder.")
    Path out;

    @Option(names = "--format", defaultValue = "csv", paramLabel = "FORMAT",
            description = "The matrix file: csv (default) or parquet.")
    MatrixFormat format;

    @Option(names = "--fitted", paramLabel = "FILE",
            description = "Reuse the encodings an earlier build fitted (its fitted.json) instead of fitting again.")
    Path fitted;

    @Option(names = "--cutoffs", split = ",", paramLabel = "DATE",
            description = "Build these cutoffs (YYYY-MM-DD, comma-separated) instead of the recipe's: a scoring run.")
    List<LocalDate> cutoffs;

    @Option(names = "--compare-to", paramLabel = "DIR",
            description = "An earlier build's folder (may be the --out folder itself) to compare the new matrix with.")
    Path compareTo;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Quern quern = recipe.load().withFormat(format);
        if (cutoffs != null) {
            quern = quern.withCutoffs(cutoffs);
        }
        if (fitted != null) {
            quern = quern.withFitted(fitted);
        }
        BuildSummary built = quern.build(out, TerminalProgress.forConsole(), Optional.ofNullable(compareTo));
        var w = spec.commandLine().getOut();
        w.printf("%d rows x %d columns (%d cutoffs) written to %s%n", built.run().rows(),
                built.columns().size(), built.compilation().plan().cutoffs().size(), out);
        built.files().forEach(f -> w.println("  " + f.getFileName()));
        built.rules().stream().filter(r -> r.failed() > 0).forEach(r -> w.printf("rule on %s: %d of %d rows %s (%s)%n",
                r.rule().table(), r.failed(), r.checked(), r.action(), r.rule().describe()));
        built.drift().ifPresent(d -> {
            List<String> findings = d.findings(Thresholds.DEFAULT);
            w.printf("drift against %s: %s (see report.html, or 'quern compare' for thresholds of your own)%n",
                    compareTo, findings.isEmpty() ? "nothing beyond the default thresholds"
                            : findings.size() + (findings.size() == 1 ? " finding" : " findings")
                            + " beyond the default thresholds");
        });
        w.println("leakage audit " + built.audit().summary() + " (see " + Quern.AUDIT_MD + ")");
        return 0;
    }
}
