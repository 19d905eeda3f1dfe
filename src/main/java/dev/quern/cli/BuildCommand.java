package dev.quern.cli;

import dev.quern.BuildSummary;
import dev.quern.run.MatrixFormat;
import dev.quern.run.TerminalProgress;
import java.nio.file.Path;
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

    @Option(names = "--format", defaultValue = "csv", paramLabel = "FORMAT",
            description = "The matrix file: csv (default) or parquet.")
    MatrixFormat format;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        BuildSummary built = recipe.load().withFormat(format).build(out, TerminalProgress.forConsole());
        var w = spec.commandLine().getOut();
        w.printf("%d rows x %d columns (%d cutoffs) written to %s%n", built.run().rows(),
                built.compilation().plan().columns().size(), built.compilation().plan().cutoffs().size(), out);
        built.files().forEach(f -> w.println("  " + f.getFileName()));
        return 0;
    }
}
