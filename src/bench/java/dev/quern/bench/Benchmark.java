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
 * <pre>{@code Benchmark PROJECT_DIR CLASS_PATH [SCALES] [SEED] [REPEAT]}</pre>
 *
 * SCALES are millions of rides, comma-separated ({@code 1,2,4}; by default 1,2). REPEAT (by default 1)
 * times every program that many times, in rounds, and takes the median. Every timed run is a
 * fresh JVM with {@code -Xmx256m}, timed from its main method's start to its exit. Each program (quern, and
 * the SQL-to-CSV runner of the hand-written query and the floor) maps a class-data archive recorded for it
 * on each engine by one untimed run before its first timed one, as quern's launcher records one on a user's
 * first build.
 */
public final class Benchmark {

    private final Path project;
    private final Path work;
    private final ChildJvm jvm;
    private final int repeat;

    private Benchmark(Path project, String classPath, int repeat) {
        this.project = project;
        this.work = project.resolve("target/bench");
        this.jvm = new ChildJvm(classPath, project);
        this.repeat = repeat;
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
        int repeat = args.length > 4 ? Integer.parseInt(args[4]) : 1;
        if (repeat < 1) {
            throw new IllegalArgumentException("bench.repeat must be at least 1, not " + repeat);
        }
        List<Dataset.Engine> engines = engines(args.length > 5 ? args[5] : "sqlite,duckdb");
        List<Measurement> results = new Benchmark(project, args[1], repeat).run(scales, seed, engines);
        Report report = new Report(results);
        Path json = project.resolve("target/bench/results.json");
        Files.writeString(json, report.json(), StandardCharsets.UTF_8);
        System.out.println();
        System.out.print(report.table());
        System.out.println("results: " + json);
    }

    /** The engines named in {@code list} (bench.engines), in the benchmark's order. */
    private static List<Dataset.Engine> engines(String list) {
        List<String> names = Arrays.stream(list.split(",")).map(String::strip).filter(s -> !s.isEmpty()).toList();
        List<Dataset.Engine> engines = new ArrayList<>();
        for (Dataset.Engine engine : Dataset.Engine.values()) {
            if (names.contains(engine.label)) {
                engines.add(engine);
            }
        }
        List<String> known = Arrays.stream(Dataset.Engine.values()).map(e -> e.label).toList();
        for (String name : names) {
            if (!known.contains(name)) {
                throw new IllegalArgumentException("bench.engines names " + name + ", not one of " + known);
            }
        }
        if (engines.isEmpty()) {
            throw new IllegalArgumentException("bench.engines names no engine; it takes " + known);
        }
        return engines;
    }

    private List<Measurement> run(double[] scales, long seed, List<Dataset.Engine> engines) throws IOException {
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
            for (Dataset.Engine engine : engines) {
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
        List<QuernVariant> variants = quernVariants();
        Map<QuernVariant, List<String>> arguments = new LinkedHashMap<>();
        for (QuernVariant variant : variants) {
            List<String> args = new ArrayList<>(List.of("build",
                    project.resolve("src/bench/resources/rides-payments.yaml").toString(),
                    "--source", url, "--out", out(runs, variant).toString()));
            args.addAll(variant.options());
            arguments.put(variant, args);
        }
        if (!Files.exists(quernClasses)) {
            jvm.require(timed("(recording classes)", jvm.run(Measurement.HEAP_LIMIT_MB + "m",
                    quernOptions(quernClasses), runs.resolve("training.log"), "dev.quern.cli.Main",
                    withOut(arguments.get(variants.get(0)), runs.resolve("training")))));
        }
        // Rounds of every program in turn, so that a slow spell of the machine falls on all of them alike.
        List<ChildJvm.Outcome> floors = new ArrayList<>();
        List<ChildJvm.Outcome> hands = new ArrayList<>();
        Map<QuernVariant, List<ChildJvm.Outcome>> querns = new LinkedHashMap<>();
        for (int round = 0; round < repeat; round++) {
            floors.add(jvm.require(timed("scan floor", sqlToCsv(sqlClasses, runs, "floor", url,
                    sql.resolve("floor.sql")))));
            hands.add(jvm.require(timed("hand-written", sqlToCsv(sqlClasses, runs, "handwritten", url,
                    sql.resolve("handwritten-" + engine.label + ".sql")))));
            for (QuernVariant variant : variants) {
                querns.computeIfAbsent(variant, v -> new ArrayList<>()).add(timed(variant.name(),
                        jvm.run(Measurement.HEAP_LIMIT_MB + "m", quernOptions(quernClasses),
                                runs.resolve(out(runs, variant).getFileName() + ".log"), "dev.quern.cli.Main",
                                arguments.get(variant))));
            }
        }
        Repeated floor = new Repeated(floors);
        Repeated hand = new Repeated(hands);
        List<Measurement> measured = new ArrayList<>();
        for (QuernVariant variant : variants) {
            Repeated quern = new Repeated(querns.get(variant));
            Path out = out(runs, variant);
            MatrixComparison.Result same = quern.ok()
                    ? MatrixComparison.compare(out.resolve("matrix.csv"), runs.resolve("handwritten.csv"))
                    : new MatrixComparison.Result(0, List.of("quern failed: see " + quern.log()), 1);
            same.differences().forEach(d -> System.out.println("    differs: " + d));
            measured.add(new Measurement(data, engine, variant.name(), same.rows(), quern.seconds(),
                    hand.seconds(), floor.seconds(), quern.peakHeapMb(), quern.ok(), same.equal(),
                    same.differences(), quern.ok() ? timings(out.resolve("provenance.json")) : Map.of(),
                    quern.all(), hand.all(), floor.all()));
        }
        return measured;
    }

    private static Path out(Path runs, QuernVariant variant) {
        return runs.resolve(variant.name().replaceAll("[^A-Za-z0-9._-]+", "_"));
    }

    /**
     * The runs of one program: its time is their median (the lower middle one for an even count), its heap
     * the largest peak, and it finished only when every run did.
     */
    private record Repeated(List<ChildJvm.Outcome> runs) {
        double seconds() {
            List<Double> sorted = all().stream().sorted().toList();
            return sorted.get((sorted.size() - 1) / 2);
        }

        List<Double> all() {
            return runs.stream().map(ChildJvm.Outcome::elapsedSeconds).toList();
        }

        double peakHeapMb() {
            return runs.stream().mapToDouble(ChildJvm.Outcome::peakHeapMb).max().orElse(Double.NaN);
        }

        boolean ok() {
            return runs.stream().allMatch(ChildJvm.Outcome::ok);
        }

        Path log() {
            return runs.stream().filter(o -> !o.ok()).findFirst().orElse(runs.get(0)).log();
        }
    }

    private ChildJvm.Outcome sqlToCsv(Path classes, Path runs, String name, String url, Path query) {
        return jvm.run(Measurement.HEAP_LIMIT_MB + "m", ChildJvm.classData(classes), runs.resolve(name + ".log"),
                SqlToCsv.class.getName(), List.of(url, query.toString(), runs.resolve(name + ".csv").toString()));
    }

    /** A quern run's JVM options: the launcher's, and its class-data archive. */
    private List<String> quernOptions(Path archive) {
        List<String> options = new ArrayList<>(jvm.quernOptions());
        options.addAll(ChildJvm.classData(archive));
        return options;
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
