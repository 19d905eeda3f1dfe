package dev.quern.cli;

import dev.quern.sample.CycleClubGenerator;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code quern sample}: the fictional cycle club's database, for demos and tests. */
@Command(name = "sample", mixinStandardHelpOptions = true,
        description = "Write the seeded sample database of a fictional cycle club (SQLite).")
final class SampleCommand implements Callable<Integer> {

    @Option(names = "--members", defaultValue = "" + CycleClubGenerator.SHIPPED_MEMBERS, description = "Number of members (default ${DEFAULT-VALUE}).")
    int members;

    @Option(names = "--seed", defaultValue = "" + CycleClubGenerator.SHIPPED_SEED, description = "Random seed (default ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = {"-o", "--out"}, required = true, paramLabel = "FILE", description = "The SQLite file to write.")
    Path out;

    @Option(names = "--replace", description = "Replace the file if it exists.")
    boolean replace;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        new CycleClubGenerator(members, seed).writeTo(out, replace);
        spec.commandLine().getOut().printf("cycle club with %d members (seed %d) written to %s%n", members, seed, out);
        return 0;
    }
}
