package dev.quern;

import dev.quern.plan.Plan;
import dev.quern.plan.Planner;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RecipeReader;
import dev.quern.report.DataDictionary;
import dev.quern.report.Provenance;
import dev.quern.run.MatrixFormat;
import dev.quern.run.MatrixWriter;
import dev.quern.run.OutputFolder;
import dev.quern.run.ParquetWriter;
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
    public static final String MATRIX_PARQUET = "matrix.parquet";
    public static final String DICTIONARY_CSV = "dictionary.csv";
    public static final String DICTIONARY_MD = "dictionary.md";
    public static final String PROVENANCE = "provenance.json";

    private final Recipe recipe;
    private final Path recipeFolder;
    private final MatrixFormat format;

    private Quern(Recipe recipe, Path recipeFolder) {
        this(recipe, recipeFolder, MatrixFormat.CSV);
    }

    private Quern(Recipe recipe, Path recipeFolder, MatrixFormat format) {
        this.recipe = recipe;
        this.recipeFolder = recipeFolder;
        this.format = format;
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

    /** The same recipe, writing the matrix in {@code format} (CSV unless told). */
    public Quern withFormat(MatrixFormat format) {
        return new Quern(recipe, recipeFolder, java.util.Objects.requireNonNull(format, "format"));
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
        Source source = source();
        Map<String, Duration> timings = new LinkedHashMap<>();
        Instant builtAt = Instant.now();
        try (Connection connection = source.open(); OutputFolder out = new OutputFolder(folder)) {
            progress.stage("checking the recipe against " + source.engine().label());
            Compilation compilation = compile(source, connection, timings);
            progress.stage("building " + format.fileName());
            RunResult run;
            Path csv = format == MatrixFormat.CSV ? null : out.scratch(MATRIX);
            try (Writer matrix = csv == null ? out.open(MATRIX) : Files.newBufferedWriter(csv, StandardCharsets.UTF_8)) {
                run = MatrixWriter.write(compilation.query(), connection, matrix, progress);
            }
            if (format == MatrixFormat.PARQUET) {
                progress.stage("writing " + format.fileName());
                ParquetWriter.convert(csv, compilation.plan().columns(), out.reserve(format.fileName()));
            }
            timings.put("query", run.queryTime());
            timings.put("write", run.writeTime());
            progress.stage("writing reports");
            DataDictionary dictionary = new DataDictionary(compilation.plan(), run);
            out.write(DICTIONARY_CSV, dictionary.csv());
            out.write(DICTIONARY_MD, dictionary.markdown());
            out.write(PROVENANCE, Provenance.render(compilation.plan(), compilation.schema(), run,
                    new Provenance.Facts(recipe.file(), sha256(recipe.text()), Version.current(), source.display(),
                            source.file().map(Quern::sha256), builtAt, timings)));
            List<Path> files = out.commit();
            return new BuildSummary(compilation, run, files);
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
