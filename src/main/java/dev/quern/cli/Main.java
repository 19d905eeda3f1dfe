package dev.quern.cli;

import dev.quern.Diagnostic;
import dev.quern.Failure;
import dev.quern.QuernException;
import dev.quern.Version;
import java.io.PrintWriter;
import java.util.List;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code quern} command: a thin shell over {@link dev.quern.Quern}. */
@Command(name = "quern", mixinStandardHelpOptions = true, versionProvider = Main.VersionProvider.class,
        description = "Compiles a feature recipe into SQL and builds a point-in-time modelling table.")
public final class Main implements Runnable {

    /** The commands, in the order help lists them; each is named by its {@code @Command} annotation. */
    private static final List<Class<?>> COMMANDS = List.of(BuildCommand.class, AuditCommand.class,
            CheckCommand.class, SqlCommand.class, LineageCommand.class, CompareCommand.class, SampleCommand.class,
            LoadCommand.class, CommandLine.HelpCommand.class);

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(run(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args));
    }

    /** Runs one command line; returns its exit code. */
    public static int run(PrintWriter out, PrintWriter err, String... args) {
        CommandLine cli = new CommandLine(new Main());
        // Picocli reads a command's options from its annotations when it is added, and its classes cannot be
        // kept in the class-data archive: a line that names its command gets that command alone, which takes
        // a few hundredths of a second off every run. Any other line (help, a version, a typo to suggest for)
        // gets them all.
        String named = args.length > 0 ? args[0] : "";
        boolean known = COMMANDS.stream().anyMatch(c -> name(c).equals(named));
        for (Class<?> command : COMMANDS) {
            if (!known || named.equals("help") || name(command).equals(named)) {
                cli.addSubcommand(command);
            }
        }
        cli.setCaseInsensitiveEnumValuesAllowed(true);
        cli.setOut(out);
        cli.setErr(err);
        cli.setExecutionExceptionHandler((e, line, parsed) -> report(e, err));
        cli.setParameterExceptionHandler((e, args1) -> {
            err.println("quern: " + e.getMessage());
            CommandLine.UnmatchedArgumentException.printSuggestions(e, err);
            err.println("Try 'quern " + (e.getCommandLine().getCommandName().equals("quern") ? ""
                    : e.getCommandLine().getCommandName() + " ") + "--help'.");
            return Failure.USAGE.exitCode();
        });
        return cli.execute(args);
    }

    private static String name(Class<?> command) {
        return command.getAnnotation(Command.class).name();
    }

    /** The one place where failures become messages and exit codes. */
    static int report(Exception e, PrintWriter err) {
        if (e instanceof QuernException q) {
            for (Diagnostic d : q.diagnostics()) {
                err.println(d.render());
            }
            return q.failure().exitCode();
        }
        err.println("quern: internal error: " + e);
        if (System.getenv("QUERN_DEBUG") != null) {
            e.printStackTrace(err);
        } else {
            err.println("Set QUERN_DEBUG=1 to see where it happened, and please report it.");
        }
        return Failure.INTERNAL.exitCode();
    }

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(),
                "name a command: build, audit, check, sql, lineage, compare, sample or load");
    }

    /** Reports the version Maven stamped into the jar. */
    static final class VersionProvider implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"quern " + Version.current()};
        }
    }
}
