package dev.quern.cli;

import dev.quern.Compilation;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Spec;

/** {@code quern check}: is the recipe right for its source? */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = "Check the recipe against its source's catalogue without building anything.")
final class CheckCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Compilation c = recipe.load().compile();
        spec.commandLine().getOut().printf("%s: ok: %d features, %d cutoffs, %d scans on %s%n",
                c.recipe().file(), c.plan().features().size(), c.plan().cutoffs().size(),
                c.plan().blocks().size() + c.plan().lookups().size() + (c.plan().label().isPresent() ? 1 : 0),
                c.source().display());
        return 0;
    }
}
