package dev.quern.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Spec;

/** {@code quern sql}: the compiled query, for review or to run by hand. */
@Command(name = "sql", mixinStandardHelpOptions = true,
        description = "Print the SQL the recipe compiles to for its source's engine.")
final class SqlCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        spec.commandLine().getOut().println(recipe.load().compile().query().formattedSql() + ";");
        return 0;
    }
}
