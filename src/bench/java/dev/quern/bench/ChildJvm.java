package dev.quern.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Properties;

/**
 * Starts a fresh JVM for each timed run, so no run profits from another's warm caches or JIT, and the
 * heap limit applies to that run alone. Its output goes to a log file beside the run's results.
 */
final class ChildJvm {

    private final String classPath;
    /** The launcher's collector and compile thresholds: every program timed gets them. */
    private final List<String> shared;
    /** The launcher's inlining options: only quern gets them (see {@link #quernOptions}). */
    private final List<String> quernOnly;

    /**
     * Runs classes from {@code classPath} with the options of the {@code quern} launcher of {@code project},
     * all but its inlining options.
     */
    ChildJvm(String classPath, Path project) {
        this.classPath = classPath;
        List<String> launcher = launcherOptions(project.resolve("src/main/launcher/jvm.options"));
        this.shared = launcher.stream().filter(o -> !tunesInlining(o)).toList();
        this.quernOnly = launcher.stream().filter(ChildJvm::tunesInlining).toList();
    }

    /** The options the launcher gives java: the file's lines, without comments and blank lines. */
    static List<String> launcherOptions(Path file) {
        try {
            return Files.readAllLines(file).stream().map(String::strip)
                    .filter(line -> !line.isEmpty() && !line.startsWith("#")).toList();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static boolean tunesInlining(String option) {
        return option.startsWith("-XX:FreqInlineSize=") || option.startsWith("-XX:InlineSmallCode=");
    }

    /**
     * The launcher's inlining options, for quern's runs: they tune the compiler for quern's code and made the
     * hand-written query's runner slower, so it runs without them. (The later compile thresholds made it a
     * little faster, if anything: every program gets those.)
     */
    List<String> quernOptions() {
        return quernOnly;
    }

    /** What {@link Measured} reported, with the child's exit code; elapsed and heap are NaN when it wrote none. */
    record Outcome(int exitCode, double elapsedSeconds, double peakHeapMb, Path log) {
        boolean ok() {
            return exitCode == 0;
        }
    }

    Outcome run(String maxHeap, Path log, String mainClass, List<String> args) {
        return run(maxHeap, List.of(), log, mainClass, args);
    }

    /** Runs {@code mainClass} as {@link #run(String, Path, String, List)} does, with more JVM options. */
    Outcome run(String maxHeap, List<String> jvmOptions, Path log, String mainClass, List<String> args) {
        Path report = log.resolveSibling(log.getFileName() + ".measured");
        // The collector and compile thresholds quern's launcher chooses, for every program timed against it.
        List<String> command = new ArrayList<>(List.of(javaBinary(), "-Xmx" + maxHeap));
        command.addAll(shared);
        command.addAll(List.of("-Dorg.jooq.no-logo=true", "-Dorg.jooq.no-tips=true"));
        command.addAll(jvmOptions);
        command.addAll(List.of("-cp", classPath, Measured.class.getName(), report.toString(), mainClass));
        command.addAll(args);
        try {
            Files.createDirectories(log.getParent());
            Files.deleteIfExists(report);
            Process process = new ProcessBuilder(command).redirectErrorStream(true)
                    .redirectOutput(log.toFile()).start();
            int exit = process.waitFor();
            Properties measured = new Properties();
            if (Files.exists(report)) {
                try (var in = Files.newBufferedReader(report)) {
                    measured.load(in);
                }
            }
            return new Outcome(exit, number(measured, "elapsed_s"), number(measured, "peak_heap_mb"), log);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while waiting for " + mainClass, e);
        }
    }

    /**
     * The JVM options that map the class-data archive {@code file} (Java's application class-data sharing,
     * JEP 350), or, while it does not exist, record it when the run exits. The quern launcher does the same
     * for its users, so every timed program starts as quern does from its launcher.
     */
    static List<String> classData(Path file) {
        String option = Files.exists(file) ? "-XX:SharedArchiveFile=" : "-XX:ArchiveClassesAtExit=";
        return List.of(option + file, "-Xlog:cds=off", "-Xlog:cds+dynamic=off");
    }

    /** Stops the benchmark when a preparation step (generating, loading) failed: nothing after it can be timed. */
    Outcome require(Outcome outcome) {
        if (!outcome.ok()) {
            throw new IllegalStateException("a step failed with exit code " + outcome.exitCode() + "; see "
                    + outcome.log());
        }
        return outcome;
    }

    private static double number(Properties p, String key) {
        String value = p.getProperty(key);
        return value == null ? Double.NaN : Double.parseDouble(value);
    }

    private static String javaBinary() {
        return Path.of(System.getProperty("java.home"), "bin", "java").toString();
    }
}
