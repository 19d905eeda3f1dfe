package dev.quern.cli;

import dev.quern.report.ColumnLineage;
import dev.quern.report.Lineage;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code quern lineage}: where output columns come from, or which columns a source column feeds. */
@Command(name = "lineage", mixinStandardHelpOptions = true,
        description = {"Show where output columns come from, or which columns a source feeds.",
                "Each column's chain: source table and columns, joins along links, time rule, measure, and "
                        + "the recipe line. With --from, every column a source column (or table) feeds, and how."})
final class LineageCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Parameters(index = "1..*", paramLabel = "COLUMN", description = "Output columns (default: all of them).")
    List<String> columns = new ArrayList<>();

    @Option(names = "--from", paramLabel = "TABLE.COLUMN",
            description = "Reverse lineage: every output column this source column (or table) feeds.")
    String from;

    @Option(names = "--json", description = "Write JSON instead of text.")
    boolean json;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        if (from != null && !columns.isEmpty()) {
            throw new picocli.CommandLine.ParameterException(spec.commandLine(),
                    "name output columns or --from a source, not both");
        }
        Lineage lineage = Lineage.of(recipe.load().compile().plan());
        var out = spec.commandLine().getOut();
        if (from != null) {
            List<Lineage.Fed> fed = lineage.fedBy(from);
            out.print(json ? Lineage.json(from, fed) : Lineage.text(from, fed));
        } else {
            List<ColumnLineage> chosen = columns.isEmpty() ? lineage.columns()
                    : columns.stream().map(lineage::column).toList();
            out.print(json ? Lineage.json(chosen) : Lineage.text(chosen));
        }
        out.flush();
        return 0;
    }
}
