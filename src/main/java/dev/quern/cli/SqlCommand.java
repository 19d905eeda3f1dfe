package dev.quern.cli;

import dev.quern.QuernException;
import dev.quern.schema.Engine;
import java.util.Arrays;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code quern sql}: the compiled query, for review or to run by hand. */
@Command(name = "sql", mixinStandardHelpOptions = true,
        description = "Print the SQL the recipe compiles to for its source's engine.")
final class SqlCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Option(names = "--engine", paramLabel = "ENGINE",
            description = "Render for this engine instead of the source's (sqlite, postgresql, mariadb, mysql, duckdb,"
                    + " spark). Tables, columns and how times are kept are still read from the source: times kept"
                    + " as text there are compared as ISO text, which also holds where the engine keeps them as"
                    + " DATE or TIMESTAMP.")
    String engine;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        var quern = recipe.load();
        var compiled = engine == null ? quern.compile() : quern.compileFor(Engine.forLabel(engine).orElseThrow(
                () -> QuernException.usage("--engine " + engine + " is not an engine Quern renders for; use one of "
                        + Arrays.stream(Engine.values()).map(Engine::label).toList())));
        spec.commandLine().getOut().println(compiled.query().formattedSql() + ";");
        return 0;
    }
}
