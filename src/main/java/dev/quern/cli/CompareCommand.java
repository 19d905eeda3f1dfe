package dev.quern.cli;

import dev.quern.report.Compare;
import dev.quern.report.Comparison;
import dev.quern.report.Thresholds;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code quern compare}: what changed between two builds, and whether it is too much. */
@Command(name = "compare", mixinStandardHelpOptions = true,
        description = {"Compare two builds; exit " + CompareCommand.BEYOND_THRESHOLDS
                        + " when a change goes beyond the thresholds.",
                "Columns added, removed or retyped, rows per cutoff, empty shares, drift per column (PSI over "
                        + "bins of the old build) and the recipe and source fingerprints from provenance.json. "
                        + "Exit 0 when nothing goes beyond the thresholds."})
final class CompareCommand implements Callable<Integer> {

    /** The exit code when a finding goes beyond the thresholds: a scheduler stops the month here. */
    static final int BEYOND_THRESHOLDS = 3;

    @Parameters(index = "0", paramLabel = "OLD_DIR", description = "The earlier build's output folder.")
    Path oldFolder;

    @Parameters(index = "1", paramLabel = "NEW_DIR", description = "The later build's output folder.")
    Path newFolder;

    @Option(names = "--max-psi", paramLabel = "X", defaultValue = "0.25",
            description = "Largest acceptable PSI of a column (default ${DEFAULT-VALUE}).")
    double maxPsi;

    @Option(names = "--max-empty-change", paramLabel = "X", defaultValue = "0.10",
            description = "Largest acceptable change of a column's empty share (default ${DEFAULT-VALUE}).")
    double maxEmptyChange;

    @Option(names = "--max-row-change", paramLabel = "X", defaultValue = "0.10",
            description = "Largest acceptable relative change of rows at a cutoff both builds have "
                    + "(default ${DEFAULT-VALUE}).")
    double maxRowChange;

    @Option(names = "--allow-column-changes",
            description = "Do not count removed or retyped columns as findings.")
    boolean allowColumnChanges;

    @Option(names = "--json", description = "Write JSON instead of text.")
    boolean json;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Thresholds limits;
        try {
            limits = new Thresholds(maxPsi, maxEmptyChange, maxRowChange, allowColumnChanges);
        } catch (IllegalArgumentException e) {
            throw new picocli.CommandLine.ParameterException(spec.commandLine(), e.getMessage());
        }
        Comparison comparison = Compare.folders(oldFolder, newFolder);
        var out = spec.commandLine().getOut();
        out.print(json ? comparison.json(limits) : comparison.text(limits));
        out.flush();
        return comparison.findings(limits).isEmpty() ? 0 : BEYOND_THRESHOLDS;
    }
}
