package dev.quern.bench;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.yaml.snakeyaml.Yaml;

/**
 * Times {@code quern build} against the SQL an analyst would write by hand and against the scan floor,
 * on the same generated data, on SQLite and DuckDB, at several scales; checks that quern's matrix equals
 * the hand-written result; writes {@code results.json} and prints a table. {@code mvn -Pbench verify}
 * runs it (see DEVELOPERS.md).
 *
 * <pre>{@code Benchmark PROJECT_DIR CLASS_PATH [SCALES] [SEED]}</pre>
 *
 * SCALES are millions of rides, comma-separated ({@code 1,2,4}; by default 1,2). Every timed run is a
 * fresh JVM with {@code -Xmx256m}, timed from its main method's start to its exit. Each program (quern, and
 * the SQL-to-CSV runner of the hand-written query and the floor) maps a class-data archive recorded for it
 * on each engine by one untimed run before its first timed one, as quern's launcher records one on a user's
 * first build.
 */
public final class Benchmark {

    private final Path project;
    private final Path work;
    private final ChildJvm jvm;

    private Benchmark(Path project, String classPath) {
        this.project = project;
        this.work = project.resolve("target/bench");
        this.jvm = new ChildJvm(classPath);
    }

    /**
     * The quern builds timed at every scale and engine. A plan shape or build option to compare is one more
     * entry here, e.g. {@code new QuernVariant("quern --plan X", List.of("--plan", "X"))}.
     */
    private static List<QuernVariant> quernVariants() {
        // The default takes the shape chosen for the engine; the range join is kept to show what the choice buys.
        return List.of(QuernVariant.DEFAULT,
                new QuernVariant("quern --shape range-join", List.of("--shape", "range-join")));
    }

    public static void main(String[] args) throws IOException {
        Path project = Path.of(args[0]).toAbsolutePath();
        double[] scales = Arrays.stream((args.length > 2 ? args[2] : "1,2").split(","))
                .map(String::strip).filter(s -> !s.isEmpty()).mapToDouble(Double::parseDouble).toArray();
        long seed = args.length > 3 ? Long.parseLong(args[3]) : dev.quern.sample.CycleClubGenerator.SHIPPED_SEED;
        List<Measurement> results = new Benchmark(project, args[1]).run(scales, seed);
        Report report = new Report(results);
        Path json = project.resolve("target/bench/results.json");
        Files.writeString(json, report.json(), StandardCharsets.UTF_8);
        System.out.println();
        System.out.print(report.table());
        System.out.println("results: " + json);
    }

    private List<Measurement> run(double[] scales, long seed) throws IOException {
        Files.createDirectories(work.resolve("data"));
        // Archives from an earlier run may describe other jars; the JVM would ignore them without a word.
        try (var old = Files.list(Files.createDirectories(archives()))) {
            for (Path file : old.toList()) {
                Files.delete(file);
            }
        }
        List<Measurement> results = new ArrayList<>();
        for (double scale : scales) {
            Dataset data = Dataset.prepare(scale, seed, work.resolve("data"), jvm);
            for (Dataset.Engine engine : Dataset.Engine.values()) {
                results.addAll(measure(data, engine));
            }
        }
        return results;
    }

    private List<Measurement> measure(Dataset data, Dataset.Engine engine) throws IOException {
        Path runs = work.resolve("runs").resolve("m" + data.members() + "-" + engine.label);
        Files.createDirectories(runs);
        String url = data.url(engine);
        Path sql = project.resolve("src/bench/resources/sql");
        System.out.printf("%,d rides on %s:%n", data.rides(), engine.label);
        Path sqlClasses = archives().resolve("sql-to-csv-" + engine.label + ".jsa");
        Path quernClasses = archives().resolve("quern-" + engine.label + ".jsa");
        if (!Files.exists(sqlClasses)) {
            jvm.require(timed("(recording classes)", sqlToCsv(sqlClasses, runs, "training", url,
                    sql.resolve("floor.sql"))));
        }
        ChildJvm.Outcome floor = timed("scan floor", sqlToCsv(sqlClasses, runs, "floor", url,
                sql.resolve("floor.sql")));
        ChildJvm.Outcome hand = timed("hand-written", sqlToCsv(sqlClasses, runs, "handwritten", url,
                sql.resolve("handwritten-" + engine.label + ".sql")));
        jvm.require(floor);
        jvm.require(hand);
        List<Measurement> measured = new ArrayList<>();
        for (QuernVariant variant : quernVariants()) {
            Path out = runs.resolve(variant.name().replaceAll("[^A-Za-z0-9._-]+", "_"));
            List<String> args = new ArrayList<>(List.of("build",
                    project.resolve("src/bench/resources/rides-payments.yaml").toString(),
                    "--source", url, "--out", out.toString()));
            args.addAll(variant.options());
            if (!Files.exists(quernClasses)) {
                jvm.require(timed("(recording classes)", jvm.run(Measurement.HEAP_LIMIT_MB + "m",
                        ChildJvm.classData(quernClasses), runs.resolve("training.log"), "dev.quern.cli.Main",
                        withOut(args, runs.resolve("training")))));
            }
            ChildJvm.Outcome quern = timed(variant.name(), jvm.run(Measurement.HEAP_LIMIT_MB + "m",
                    ChildJvm.classData(quernClasses), runs.resolve(out.getFileName() + ".log"),
                    "dev.quern.cli.Main", args));
            MatrixComparison.Result same = quern.ok()
                    ? MatrixComparison.compare(out.resolve("matrix.csv"), runs.resolve("handwritten.csv"))
                    : new MatrixComparison.Result(0, List.of("quern failed: see " + quern.log()), 1);
            same.differences().forEach(d -> System.out.println("    differs: " + d));
            measured.add(new Measurement(data, engine, variant.name(), same.rows(), quern.elapsedSeconds(),
                    hand.elapsedSeconds(), floor.elapsedSeconds(), quern.peakHeapMb(), quern.ok(), same.equal(),
                    same.differences(), quern.ok() ? timings(out.resolve("provenance.json")) : Map.of()));
        }
        return measured;
    }

    private ChildJvm.Outcome sqlToCsv(Path classes, Path runs, String name, String url, Path query) {
        return jvm.run(Measurement.HEAP_LIMIT_MB + "m", ChildJvm.classData(classes), runs.resolve(name + ".log"),
                SqlToCsv.class.getName(), List.of(url, query.toString(), runs.resolve(name + ".csv").toString()));
    }

    private Path archives() {
        return work.resolve("class-data");
    }

    /** The build's arguments with another output folder. */
    private static List<String> withOut(List<String> args, Path out) {
        List<String> changed = new ArrayList<>(args);
        changed.set(changed.indexOf("--out") + 1, out.toString());
        return changed;
    }

    private static ChildJvm.Outcome timed(String what, ChildJvm.Outcome outcome) {
        System.out.printf("  %-14s %8.2f s  peak heap %6.1f MB%s%n", what, outcome.elapsedSeconds(),
                outcome.peakHeapMb(), outcome.ok() ? "" : "  FAILED (exit " + outcome.exitCode() + ", see "
                        + outcome.log() + ")");
        return outcome;
    }

    /** Where quern's own time went (schema, compile, rules, audit, query, write), from its provenance. */
    private static Map<String, Object> timings(Path provenance) throws IOException {
        try (Reader in = Files.newBufferedReader(provenance, StandardCharsets.UTF_8)) {
            Map<String, Object> root = new Yaml().load(in);
            Object timings = root.get("timings");
            return timings instanceof Map<?, ?> map ? new LinkedHashMap<>(castKeys(map)) : Map.of();
        }
    }

    private static Map<String, Object> castKeys(Map<?, ?> map) {
        Map<String, Object> out = new LinkedHashMap<>();
        map.forEach((k, v) -> out.put(String.valueOf(k), v));
        return out;
    }
}
