package dev.quern.cli;

import dev.quern.BuildSummary;
import dev.quern.Quern;
import dev.quern.run.TerminalProgress;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code quern build}: the modelling table and its reports. */
@Command(name = "build", mixinStandardHelpOptions = true,
        description = "Build the modelling table, data dictionary and provenance into a folder.")
final class BuildCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Option(names = {"-o", "--out"}, required = true, paramLabel = "DIR", description = "The output folder.")
    Path out;

    @Option(names = "--fitted", paramLabel = "FILE",
            description = "Reuse the encodings an earlier build fitted (its fitted.json) instead of fitting again.")
    Path fitted;

    @Option(names = "--cutoffs", split = ",", paramLabel = "DATE",
            description = "Build these cutoffs (YYYY-MM-DD, comma-separated) instead of the recipe's: a scoring run.")
    List<LocalDate> cutoffs;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Quern quern = recipe.load();
        if (cutoffs != null) {
            quern = quern.withCutoffs(cutoffs);
        }
        if (fitted != null) {
            quern = quern.withFitted(fitted);
        }
        BuildSummary built = quern.build(out, TerminalProgress.forConsole());
        var w = spec.commandLine().getOut();
        w.printf("%d rows x %d columns (%d cutoffs) written to %s%n", built.run().rows(),
                built.columns().size(), built.compilation().plan().cutoffs().size(), out);
        built.files().forEach(f -> w.println("  " + f.getFileName()));
        built.rules().stream().filter(r -> r.failed() > 0).forEach(r -> w.printf("rule on %s: %d of %d rows %s (%s)%n",
                r.rule().table(), r.failed(), r.checked(), r.action(), r.rule().describe()));
        return 0;
    }
}
