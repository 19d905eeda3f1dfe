package dev.quern;

import dev.quern.audit.Audit;
import dev.quern.audit.AuditReport;
import dev.quern.plan.Plan;
import dev.quern.plan.Planner;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RecipeReader;
import dev.quern.report.DataDictionary;
import dev.quern.report.Provenance;
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
import java.util.ArrayList;
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
    public static final String AUDIT_JSON = "audit.json";
    public static final String AUDIT_MD = "audit.md";

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
        Source source = source();
        Map<String, Duration> timings = new LinkedHashMap<>();
        Instant builtAt = Instant.now();
        try (Connection connection = source.open(); OutputFolder out = new OutputFolder(folder)) {
            progress.stage("checking the recipe against " + source.engine().label());
            Compilation compilation = compile(source, connection, timings);
            Audit leakage = Audit.of(recipe, compilation.plan(), compilation.schema());
            progress.stage("building " + MATRIX);
            RunResult run;
            try (Writer matrix = out.open(MATRIX)) {
                run = MatrixWriter.write(compilation.query(), connection, matrix, progress);
            }
            timings.put("query", run.queryTime());
            timings.put("write", run.writeTime());
            progress.stage("auditing for leakage");
            long auditStart = System.nanoTime();
            AuditReport audit = leakage.run(connection, out.pending(MATRIX));
            timings.put("audit", Duration.ofNanos(System.nanoTime() - auditStart));
            out.write(AUDIT_JSON, audit.json());
            out.write(AUDIT_MD, audit.markdown());
            if (audit.blocked()) {
                // The audit is the one output of a blocked build: no matrix, and nothing that describes one.
                out.discard(MATRIX);
                out.commit();
                throw blockedBy(audit, folder);
            }
            progress.stage("writing reports");
            DataDictionary dictionary = new DataDictionary(audit.annotate(compilation.plan()), run);
            out.write(DICTIONARY_CSV, dictionary.csv());
            out.write(DICTIONARY_MD, dictionary.markdown());
            out.write(PROVENANCE, Provenance.render(compilation.plan(), compilation.schema(), run,
                    new Provenance.Facts(recipe.file(), sha256(recipe.text()), Version.current(), source.display(),
                            source.file().map(Quern::sha256), builtAt, timings)));
            List<Path> files = out.commit();
            return new BuildSummary(compilation, run, audit, files);
        } catch (IOException e) {
            throw QuernException.output("writing to " + folder + " failed: " + e.getMessage(), e);
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        } finally {
            progress.done();
        }
    }

    /**
     * Runs the leakage audit alone: builds the matrix into a temporary file (streamed, so memory stays flat;
     * the disk holds one matrix), audits it and removes it. Writes nothing else.
     */
    public AuditReport audit(Progress progress) {
        Source source = source();
        Path temp = null;
        try (Connection connection = source.open()) {
            progress.stage("checking the recipe against " + source.engine().label());
            Compilation compilation = compile(source, connection, new LinkedHashMap<>());
            Audit leakage = Audit.of(recipe, compilation.plan(), compilation.schema());
            progress.stage("building the matrix to audit");
            temp = Files.createTempFile("quern-audit-", ".csv");
            try (Writer matrix = Files.newBufferedWriter(temp, StandardCharsets.UTF_8)) {
                MatrixWriter.write(compilation.query(), connection, matrix, progress);
            }
            progress.stage("auditing for leakage");
            return leakage.run(connection, temp);
        } catch (IOException e) {
            throw QuernException.output("cannot write the temporary matrix to audit: " + e.getMessage(), e);
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        } finally {
            progress.done();
            if (temp != null) {
                try {
                    Files.deleteIfExists(temp);
                } catch (IOException e) {
                    // A temporary file left behind is not worth failing the audit for.
                }
            }
        }
    }

    /** The failure of a build the audit blocked: each open blocking finding, then where to read more. */
    static QuernException blockedBy(AuditReport audit, Path folder) {
        List<Diagnostic> diagnostics = new ArrayList<>(audit.blocking());
        diagnostics.add(Diagnostic.at(Position.NONE, "the leakage audit blocked the build: " + MATRIX
                + " was not written; see " + folder.resolve(AUDIT_MD) + ", and fix each blocking finding or"
                + " acknowledge it under audit.acknowledge with a reason"));
        return new QuernException(Failure.LEAKAGE, diagnostics);
    }

    private Compilation compile(Source source, Connection connection, Map<String, Duration> timings) {
        long t0 = System.nanoTime();
        SourceSchema schema = new SchemaReader(connection, source.engine()).read(recipe);
        long t1 = System.nanoTime();
        Plan plan = Planner.plan(recipe, schema);
        Audit.checkAcknowledgements(recipe, plan);
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
