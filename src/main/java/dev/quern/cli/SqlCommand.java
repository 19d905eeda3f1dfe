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
        description = "Print the SQL the recipe compiles to for its source's engine: the main query, then one"
                + " ordered scan per block computed that way.")
final class SqlCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @picocli.CommandLine.Option(names = "--explain",
            description = "Say above the SQL, as comments, which shape each block takes and why.")
    boolean explain;

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
        var query = compiled.query();
        var out = spec.commandLine().getOut();
        out.print((explain ? query.explain() + "\n" : "") + query.script());
        out.flush();
        return 0;
    }
}
