package dev.quern.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
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

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        var query = recipe.load().compile().query();
        var out = spec.commandLine().getOut();
        out.print((explain ? query.explain() + "\n" : "") + query.script());
        out.flush();
        return 0;
    }
}
