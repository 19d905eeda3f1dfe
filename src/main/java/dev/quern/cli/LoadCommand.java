package dev.quern.cli;

import dev.quern.load.ColumnKind;
import dev.quern.load.DatabaseLoader;
import dev.quern.load.LoadSummary;
import dev.quern.load.LoadedTable;
import dev.quern.run.TerminalProgress;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code quern load}: a SQLite database copied into a server or DuckDB, for demos and tests. */
@Command(name = "load", mixinStandardHelpOptions = true,
        description = {"Copy every table of a SQLite database into PostgreSQL, MariaDB, MySQL or DuckDB, with"
                + " proper types and indexes on keys and times.",
                "This is the only command that writes to a database, and only to the one --to names."})
final class LoadCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "SQLITE_FILE", description = "The SQLite database to copy.")
    Path sqlite;

    @Option(names = "--to", required = true, paramLabel = "URL",
            description = "The target's JDBC URL; credentials only as ${VARIABLES}, e.g. password=${PGPASSWORD}.")
    String to;

    @Option(names = "--replace", description = "Drop and load again tables that exist in the target.")
    boolean replace;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        LoadSummary summary = DatabaseLoader.load(sqlite, to, replace, TerminalProgress.forConsole());
        var w = spec.commandLine().getOut();
        w.printf("%d tables, %d rows loaded into %s in %.1f s%n", summary.tables().size(), summary.rows(),
                summary.target(), summary.time().toMillis() / 1000.0);
        for (LoadedTable t : summary.tables()) {
            w.printf("  %s: %d rows, %d columns%s%n", t.name(), t.rows(), t.columns().size(), describe(t));
        }
        return 0;
    }

    private static String describe(LoadedTable t) {
        String times = t.columns().stream()
                .filter(c -> c.kind() == ColumnKind.DATE || c.kind() == ColumnKind.TIMESTAMP)
                .map(c -> c.name() + " " + c.targetType()).collect(Collectors.joining(", "));
        return (times.isEmpty() ? "" : "; times: " + times)
                + (t.primaryKey().isEmpty() ? "" : "; key " + String.join(", ", t.primaryKey()))
                + (t.indexes().isEmpty() ? "" : "; " + t.indexes().size() + " indexes");
    }
}
