package dev.quern;

import dev.quern.plan.Plan;
import dev.quern.plan.Planner;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RecipeReader;
import dev.quern.report.BuildFiles;
import dev.quern.report.Compare;
import dev.quern.report.Comparison;
import dev.quern.report.DataDictionary;
import dev.quern.report.HtmlReport;
import dev.quern.report.Lineage;
import dev.quern.report.Provenance;
import dev.quern.report.Thresholds;
import dev.quern.run.MatrixWriter;
import dev.quern.run.OutputFolder;
import dev.quern.run.Progress;
import dev.quern.run.RunResult;
import dev.quern.schema.SchemaReader;
import dev.quern.schema.Source;
import dev.quern.schema.SourceSchema;
import dev.quern.sql.CompiledQuery;
import dev.quern.sql.SqlCompiler;
import java.io.IOException;
import java.io.InputStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Duration;
import java.time.Instant;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Quern's Java API: a recipe on its way through the stages (recipe, schema, plan, sql, run, report).
 * The command line is a thin shell over this class.
 *
 * <pre>{@code
 * BuildSummary built = Quern.load(Path.of("recipes/member-churn.yaml")).build(Path.of("out"), Progress.SILENT);
 * }</pre>
 */
public final class Quern {

    public static final String MATRIX = "matrix.csv";
    public static final String DICTIONARY_CSV = "dictionary.csv";
    public static final String DICTIONARY_MD = "dictionary.md";
    public static final String PROVENANCE = "provenance.json";
    public static final String REPORT = "report.html";

    private final Recipe recipe;
    private final Path recipeFolder;

    private Quern(Recipe recipe, Path recipeFolder) {
        this.recipe = recipe;
        this.recipeFolder = recipeFolder;
    }

    /** Reads and parses a recipe file; relative SQLite paths in it are read from the file's folder. */
    public static Quern load(Path recipeFile) {
        Path folder = Optional.ofNullable(recipeFile.toAbsolutePath().getParent()).orElse(Path.of("."));
        return new Quern(RecipeReader.read(recipeFile), folder);
    }

    /** A recipe given as text; relative SQLite paths are read from {@code folder}. */
    public static Quern of(Recipe recipe, Path folder) {
        return new Quern(recipe, folder);
    }

    /** The same recipe reading another source (a JDBC URL; may name {@code ${VARIABLES}}). */
    public Quern withSource(String url) {
        return new Quern(recipe.withSource(url), Path.of("").toAbsolutePath());
    }

    public Recipe recipe() {
        return recipe;
    }

    public Source source() {
        return Source.of(recipe.source(), recipeFolder);
    }

    /** Checks the recipe against the source and compiles it, reading the catalogue but no feature data. */
    public Compilation compile() {
        Source source = source();
        try (Connection connection = source.open()) {
            return compile(source, connection, new LinkedHashMap<>());
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        }
    }

    /** Builds the modelling table and its reports into {@code folder}; all or nothing. */
    public BuildSummary build(Path folder, Progress progress) {
        return build(folder, progress, Optional.empty());
    }

    /**
     * Builds as {@link #build(Path, Progress)} does, and when {@code compareTo} names an earlier build's
     * folder (it may be {@code folder} itself), compares the new matrix with it; the drift goes into
     * report.html and the summary.
     */
    public BuildSummary build(Path folder, Progress progress, Optional<Path> compareTo) {
        Optional<BuildFiles> earlier = compareTo.map(BuildFiles::read);
        Source source = source();
        Map<String, Duration> timings = new LinkedHashMap<>();
        Instant builtAt = Instant.now();
        try (Connection connection = source.open(); OutputFolder out = new OutputFolder(folder)) {
            progress.stage("checking the recipe against " + source.engine().label());
            Compilation compilation = compile(source, connection, timings);
            progress.stage("building " + MATRIX);
            RunResult run;
            try (Writer matrix = out.open(MATRIX)) {
                run = MatrixWriter.write(compilation.query(), connection, matrix, progress);
            }
            timings.put("query", run.queryTime());
            timings.put("write", run.writeTime());
            progress.stage("writing reports");
            Lineage lineage = Lineage.of(compilation.plan());
            DataDictionary dictionary = new DataDictionary(compilation.plan(), run, lineage);
            String dictionaryCsv = dictionary.csv();
            out.write(DICTIONARY_CSV, dictionaryCsv);
            out.write(DICTIONARY_MD, dictionary.markdown());
            String recipeHash = sha256(recipe.text());
            String provenance = Provenance.render(compilation.plan(), compilation.schema(), run,
                    new Provenance.Facts(recipe.file(), recipeHash, Version.current(), source.display(),
                            source.file().map(Quern::sha256), builtAt, timings));
            out.write(PROVENANCE, provenance);
            Optional<Comparison> drift = Optional.empty();
            if (earlier.isPresent()) {
                progress.stage("comparing with " + earlier.get().name());
                drift = Optional.of(Compare.of(earlier.get(),
                        BuildFiles.of(folder.toString(), out.pending(MATRIX), dictionaryCsv, provenance)));
            }
            out.write(REPORT, HtmlReport.render(compilation.plan(), run, lineage,
                    new HtmlReport.Facts(recipe.file(), recipeHash, Version.current(), source.display(), builtAt),
                    drift, Thresholds.DEFAULT));
            List<Path> files = out.commit();
            return new BuildSummary(compilation, run, files, drift);
        } catch (IOException e) {
            throw QuernException.output("writing to " + folder + " failed: " + e.getMessage(), e);
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        } finally {
            progress.done();
        }
    }

    private Compilation compile(Source source, Connection connection, Map<String, Duration> timings) {
        long t0 = System.nanoTime();
        SourceSchema schema = new SchemaReader(connection, source.engine()).read(recipe);
        long t1 = System.nanoTime();
        Plan plan = Planner.plan(recipe, schema);
        CompiledQuery query = SqlCompiler.compile(plan);
        long t2 = System.nanoTime();
        timings.put("schema", Duration.ofNanos(t1 - t0));
        timings.put("compile", Duration.ofNanos(t2 - t1));
        return new Compilation(recipe, source, schema, plan, query);
    }

    static String sha256(String text) {
        return HexFormat.of().formatHex(digest().digest(text.getBytes(StandardCharsets.UTF_8)));
    }

    static String sha256(Path file) {
        MessageDigest digest = digest();
        try (InputStream in = Files.newInputStream(file)) {
            byte[] buffer = new byte[1 << 16];
            for (int n; (n = in.read(buffer)) > 0; ) {
                digest.update(buffer, 0, n);
            }
        } catch (IOException e) {
            throw QuernException.data("cannot read " + file + " to fingerprint it: " + e.getMessage(), e);
        }
        return HexFormat.of().formatHex(digest.digest());
    }

    private static MessageDigest digest() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
