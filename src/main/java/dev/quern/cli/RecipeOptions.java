package dev.quern.cli;

import dev.quern.Quern;
import java.nio.file.Path;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** The recipe argument and the source override that every recipe command takes. */
final class RecipeOptions {

    @Parameters(index = "0", paramLabel = "RECIPE", description = "The recipe file (YAML).")
    Path recipe;

    @Option(names = "--source", paramLabel = "URL",
            description = "Read this JDBC URL instead of the recipe's source; may name $${VARIABLES}.")
    String source;

    Quern load() {
        Quern quern = Quern.load(recipe);
        return source == null ? quern : quern.withSource(source);
    }
}
