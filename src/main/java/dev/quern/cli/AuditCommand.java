package dev.quern.cli;

import dev.quern.Failure;
import dev.quern.Quern;
import dev.quern.audit.AuditReport;
import dev.quern.run.OutputFolder;
import dev.quern.run.TerminalProgress;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code quern audit}: the leakage audit alone, without writing a matrix. */
@Command(name = "audit", mixinStandardHelpOptions = true,
        description = "Run the leakage audit alone: print audit.md, and write audit.json and audit.md with --out."
                + " Exits 67 when a blocking finding is not acknowledged.")
final class AuditCommand implements Callable<Integer> {

    @Mixin
    RecipeOptions recipe = new RecipeOptions();

    @Option(names = {"-o", "--out"}, paramLabel = "DIR", description = "Write audit.json and audit.md here.")
    Path out;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        AuditReport report = recipe.load().audit(TerminalProgress.forConsole());
        if (out != null) {
            try (OutputFolder folder = new OutputFolder(out)) {
                folder.write(Quern.AUDIT_JSON, report.json());
                folder.write(Quern.AUDIT_MD, report.markdown());
                folder.commit();
            }
        }
        var w = spec.commandLine().getOut();
        w.print(report.markdown());
        w.flush();
        if (report.blocked()) {
            spec.commandLine().getErr().println("quern: the leakage audit is " + report.summary());
            return Failure.LEAKAGE.exitCode();
        }
        return 0;
    }
}
